//! PromptAdapter: the unsaved-changes banner, the questions over the page, and the
//! window's close request (it asks first while changes are unsaved).

use slint::{CloseRequestResponse, ComponentHandle};

use super::super::session::{AfterPrompt, Session};
use super::super::ui::{AppWindow, PromptAdapter, PromptChoice};
use super::{Shared, act, handles, model};

pub fn connect(ui: &AppWindow, s: &Shared) {
    let a = ui.global::<PromptAdapter>();
    let (w, st) = handles(ui, s);
    a.on_retry(move || act(&w, &st, |x| x.retry_saves()));
    let (w, st) = handles(ui, s);
    a.on_choose(move |i| {
        let mut after = AfterPrompt::Stay;
        act(&w, &st, |x| after = x.answer_prompt(i.max(0) as usize));
        if after == AfterPrompt::CloseWindow
            && let Some(ui) = w.upgrade()
        {
            let _ = ui.hide();
        }
    });
    let (w, st) = handles(ui, s);
    ui.window().on_close_requested(move || {
        let mut may_close = true;
        act(&w, &st, |x| may_close = x.close_requested());
        if may_close {
            CloseRequestResponse::HideWindow
        } else {
            CloseRequestResponse::KeepWindowShown
        }
    });
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    let a = ui.global::<PromptAdapter>();
    a.set_unsaved(s.unsaved_text().into());
    match s.prompt_text() {
        Some((text, answers)) => {
            a.set_text(text.into());
            a.set_choices(model(
                answers
                    .into_iter()
                    .map(|(text, label, primary)| PromptChoice {
                        text: text.into(),
                        label: label.into(),
                        primary,
                    })
                    .collect(),
            ));
            a.set_open(true);
        }
        None => a.set_open(false),
    }
}
