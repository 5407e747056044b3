//! Adapters: connect the session to each page's Slint global and push view data back.
//! Every callback runs one session method, then the views are refreshed.

mod chart_adapter;
mod fill_adapter;
mod gauge_chooser_adapter;
mod keypad_adapter;
mod language_adapter;
mod locker_adapter;
mod nav_adapter;
mod picker_adapter;
mod prompt_adapter;
mod settings_adapter;
mod share_adapter;
mod team_adapter;
mod turns_adapter;

use std::cell::RefCell;
use std::rc::Rc;

use slint::{ComponentHandle, ModelRc, SharedString, VecModel};

use super::session::Session;
use super::ui::AppWindow;

pub type Shared = Rc<RefCell<Session>>;

/// Run an action on the session, then refresh every view.
pub(crate) fn act(w: &slint::Weak<AppWindow>, s: &Shared, f: impl FnOnce(&mut Session)) {
    {
        let mut x = s.borrow_mut();
        x.begin_action();
        f(&mut x);
    }
    if let Some(ui) = w.upgrade() {
        refresh_all(&ui, &s.borrow());
    }
}

/// A callback closure's captures: the window (weak) and the session.
pub(crate) fn handles(ui: &AppWindow, s: &Shared) -> (slint::Weak<AppWindow>, Shared) {
    (ui.as_weak(), s.clone())
}

pub(crate) fn model<T: Clone + 'static>(v: Vec<T>) -> ModelRc<T> {
    ModelRc::new(VecModel::from(v))
}

pub(crate) fn strings(v: Vec<String>) -> ModelRc<SharedString> {
    model(v.into_iter().map(SharedString::from).collect())
}

pub fn connect_all(ui: &AppWindow, s: &Shared) {
    nav_adapter::connect(ui, s);
    team_adapter::connect(ui, s);
    picker_adapter::connect(ui, s);
    keypad_adapter::connect(ui, s);
    locker_adapter::connect(ui, s);
    settings_adapter::connect(ui, s);
    fill_adapter::connect(ui, s);
    gauge_chooser_adapter::connect(ui, s);
    chart_adapter::connect(ui, s);
    turns_adapter::connect(ui, s);
    share_adapter::connect(ui, s);
    prompt_adapter::connect(ui, s);
}

pub fn refresh_all(ui: &AppWindow, s: &Session) {
    language_adapter::apply(s.language());
    nav_adapter::refresh(ui, s);
    team_adapter::refresh(ui, s);
    turns_adapter::refresh(ui, s);
    share_adapter::refresh(ui, s);
    picker_adapter::refresh(ui, s);
    keypad_adapter::refresh(ui, s);
    locker_adapter::refresh(ui, s);
    settings_adapter::refresh(ui, s);
    fill_adapter::refresh(ui, s);
    gauge_chooser_adapter::refresh(ui, s);
    chart_adapter::refresh(ui, s);
    prompt_adapter::refresh(ui, s);
}
