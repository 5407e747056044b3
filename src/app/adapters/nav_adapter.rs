//! Nav and StatusAdapter globals.

use slint::ComponentHandle;

use super::super::nav::Screen;
use super::super::ui::{AppWindow, Nav, Page, StatusAdapter};
use super::{Shared, act, handles};
use crate::app::session::Session;
use crate::app::view_models as vm;

fn page(s: Screen) -> Page {
    match s {
        Screen::Cautions => Page::Cautions,
        Screen::Team => Page::Team,
        Screen::Turns => Page::Turns,
        Screen::Buddy => Page::Buddy,
        Screen::Locker => Page::Locker,
        Screen::LockerEdit => Page::LockerEdit,
        Screen::Settings => Page::Settings,
        Screen::Fill => Page::Fill,
        Screen::Chart => Page::Chart,
    }
}

fn screen(p: Page) -> Screen {
    match p {
        Page::Cautions => Screen::Cautions,
        Page::Team => Screen::Team,
        Page::Turns => Screen::Turns,
        Page::Buddy => Screen::Buddy,
        Page::Locker => Screen::Locker,
        Page::LockerEdit => Screen::LockerEdit,
        Page::Settings => Screen::Settings,
        Page::Fill => Screen::Fill,
        Page::Chart => Screen::Chart,
    }
}

pub fn connect(ui: &AppWindow, s: &Shared) {
    let nav = ui.global::<Nav>();
    let (w, st) = handles(ui, s);
    nav.on_go(move |p| act(&w, &st, |x| x.go(screen(p))));
    let (w, st) = handles(ui, s);
    nav.on_back(move || {
        let mut handled = false;
        act(&w, &st, |x| handled = x.back());
        handled
    });
    let (w, st) = handles(ui, s);
    ui.global::<StatusAdapter>()
        .on_dismiss(move || act(&w, &st, |x| x.dismiss_status()));
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    ui.global::<Nav>().set_page(page(s.page()));
    ui.global::<StatusAdapter>()
        .set_message(vm::keep_units_together(&vm::status(s)).into());
    ui.global::<StatusAdapter>()
        .set_demo_note(vm::demo_note(s).into());
}
