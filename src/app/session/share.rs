//! The plan for every diver's phone: as plain text (`formats::plan_text`), shown as a
//! QR code over the Turns page or the buddy view, or copied to the clipboard. Only while
//! the Turns page shows turns: the same answer (`TeamController::turns_gate`).

use chrono::TimeZone;

use crate::app::clipboard::TextClipboard;
use crate::formats::plan_text::{PlanReads, plan_text};
use crate::i18n::{tr_n, tr_with};

use super::Session;

impl Session {
    /// The plan as text, or None while a start is not read for this dive (then the
    /// Turns page shows no turns either).
    pub fn plan_text(&self) -> Option<String> {
        if !self.team.turns_gate(self.now()).open() {
            return None;
        }
        let input = self.team.input();
        let n = input.divers.len();
        let made = chrono::Local
            .timestamp_opt(self.now, 0)
            .single()
            // ISO 8601 date: the same in every language (no month names to translate).
            .map(|t| t.format("%Y-%m-%d %H:%M").to_string());
        let reads = PlanReads {
            read_at: (0..n).map(|i| self.read_text(i)).collect(),
            stage_read: (0..n)
                .map(|i| {
                    self.team
                        .stage_status(i, self.now)
                        .is_some_and(|st| st.usable())
                })
                .collect(),
            made,
        };
        Some(plan_text(input, self.team.plan(), &reads))
    }

    /// Open the QR code of the plan; while turns are not shown, say why instead.
    pub fn open_plan_qr(&mut self) {
        match self.team.turns_gate(self.now()).sentence() {
            None => self.plan_qr = true,
            Some(why) => {
                self.plan_qr = false;
                self.status
                    .push(tr_with("No plan to share yet. {0}", &[&why]));
            }
        }
    }

    /// Close the QR code.
    pub fn close_plan_qr(&mut self) {
        self.plan_qr = false;
    }

    /// Whether the QR code is on screen: opened, and the turns still shown (a start
    /// that ages out takes it away with the turns).
    pub fn plan_qr_open(&self) -> bool {
        self.plan_qr && self.team.turns_gate(self.now()).open()
    }

    /// "Copy plan as text": the plan onto `clipboard`; the status says what happened.
    pub fn copy_plan_text(&mut self, clipboard: &mut dyn TextClipboard) {
        let Some(text) = self.plan_text() else {
            let why = self
                .team
                .turns_gate(self.now())
                .sentence()
                .unwrap_or_default();
            self.status
                .push(tr_with("No plan to copy yet. {0}", &[&why]));
            return;
        };
        let lines = text.lines().count();
        self.status.push(match clipboard.put_text(&text) {
            Ok(()) => tr_n(
                "Plan copied as text ({n} line): paste it into a message.",
                "Plan copied as text ({n} lines): paste it into a message.",
                lines as u64,
                &[],
            ),
            Err(e) => tr_with(
                "The plan could not be copied: no clipboard is available here ({0}). Show the QR code or save the team card instead.",
                &[&e],
            ),
        });
    }
}

#[cfg(test)]
mod tests {
    use crate::app::clipboard::TextClipboard;
    use crate::app::session::test_session;

    struct Kept(Vec<String>);
    impl TextClipboard for Kept {
        fn put_text(&mut self, text: &str) -> Result<(), String> {
            self.0.push(text.to_string());
            Ok(())
        }
    }
    struct Headless;
    impl TextClipboard for Headless {
        fn put_text(&mut self, _: &str) -> Result<(), String> {
            Err("X11 server connection timed out".to_string())
        }
    }

    #[test]
    fn no_plan_text_and_no_qr_until_every_start_is_read() {
        let (_dir, mut s) = test_session();
        assert_eq!(s.plan_text(), None, "the demo's starts are unread");
        s.open_plan_qr();
        assert!(!s.plan_qr_open());
        assert!(s.status.text().contains("No plan to share yet"));
        let mut clip = Kept(Vec::new());
        s.copy_plan_text(&mut clip);
        assert!(clip.0.is_empty());
        assert!(s.status.text().contains("No plan to copy yet"));
        for i in 0..s.team.len() {
            s.confirm_start(i);
        }
        let text = s.plan_text().expect("every start read");
        s.open_plan_qr();
        assert!(s.plan_qr_open());
        assert!(s.back(), "Back closes the QR code first");
        assert!(!s.plan_qr_open());
        s.copy_plan_text(&mut clip);
        assert_eq!(clip.0, vec![text.clone()]);
        assert!(
            s.status.text().contains("Plan copied"),
            "{}",
            s.status.text()
        );
        for d in &s.team.plan().divers {
            assert!(text.contains(&format!("{}: start", d.name)), "{text}");
        }
    }

    #[test]
    fn a_missing_clipboard_is_a_message_not_a_panic() {
        let (_dir, mut s) = test_session();
        for i in 0..s.team.len() {
            s.confirm_start(i);
        }
        s.copy_plan_text(&mut Headless);
        let msg = s.status.text();
        assert!(
            msg.contains("could not be copied") && msg.contains("X11 server connection timed out"),
            "{msg}"
        );
    }
}
