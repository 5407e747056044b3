//! PlanQrAdapter: the plan as a QR code over the Turns page and the buddy view, and
//! "Copy plan as text". The code is drawn again only when the plan's text changes.

use std::cell::RefCell;
use std::rc::Rc;

use slint::ComponentHandle;

use super::super::clipboard::{SystemClipboard, has_clipboard};
use super::super::qr_image::qr_image;
use super::super::session::Session;
use super::super::ui::{AppWindow, PlanQrAdapter};
use super::{Shared, act, handles};
use crate::i18n::tr;

pub fn connect(ui: &AppWindow, s: &Shared) {
    let a = ui.global::<PlanQrAdapter>();
    a.set_can_copy(has_clipboard());
    let (w, st) = handles(ui, s);
    a.on_show(move || act(&w, &st, |x| x.open_plan_qr()));
    let (w, st) = handles(ui, s);
    a.on_close(move || act(&w, &st, |x| x.close_plan_qr()));
    // One clipboard for the window's life: on Linux the text stays copied while it
    // lives (or until a clipboard manager takes it).
    let clipboard = Rc::new(RefCell::new(SystemClipboard::default()));
    let (w, st) = handles(ui, s);
    a.on_copy_text(move || {
        let clip = clipboard.clone();
        act(&w, &st, |x| x.copy_plan_text(&mut *clip.borrow_mut()))
    });
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    let a = ui.global::<PlanQrAdapter>();
    let text = s.plan_text();
    a.set_available(text.is_some());
    let open = s.plan_qr_open();
    a.set_open(open);
    let (Some(text), true) = (text, open) else {
        return;
    };
    if a.get_text() == text.as_str() {
        return;
    }
    match qr_image(&text) {
        Some(image) => {
            a.set_code(image);
            a.set_caption(
                tr("Point a phone camera at the code: it reads the plan as plain text, with no app and no network.")
                    .into(),
            );
        }
        None => {
            a.set_code(slint::Image::default());
            a.set_caption(
                tr("The plan is too long for one QR code. Copy it as text or save the team card instead.")
                    .into(),
            );
        }
    }
    a.set_text(text.into());
}
