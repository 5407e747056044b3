//! Questions over the page that need an answer: closing the window with unsaved changes,
//! and leaving a changed locker edit.

use super::super::nav::Screen;
use super::Session;
use crate::i18n::{tr, tr_with};

/// A question shown over the page until it is answered.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Default)]
pub enum Prompt {
    #[default]
    None,
    /// The window is closing with unsaved changes: close anyway, try again, stay.
    Close,
    /// Leaving the locker editor with changes: keep editing, discard.
    Discard,
    /// A rule that does not suit an overhead dive was chosen: keep the rule, use it.
    LooseRule(crate::plan::Rule),
}

/// An answer to a prompt: its text, accessible label, and whether it is the one to stress.
pub type Answer = (String, String, bool);

/// What the window must do after an answer.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum AfterPrompt {
    Stay,
    CloseWindow,
}

impl Session {
    /// The window is asked to close: save, and say whether it may close now. With
    /// changes that could not be saved, the close prompt opens instead.
    pub fn close_requested(&mut self) -> bool {
        self.save_all();
        if self.all_saved() {
            true
        } else {
            self.prompt = Prompt::Close;
            false
        }
    }

    /// Back from the locker editor: asks once when the draft was changed.
    pub(super) fn leave_locker_edit(&mut self) -> bool {
        if self.locker.draft_changed() {
            self.prompt = Prompt::Discard;
            return true;
        }
        self.locker.drop_draft();
        self.nav.back()
    }

    /// The question on screen and its answers (text, accessible label, the one to
    /// stress).
    pub fn prompt_text(&self) -> Option<(String, Vec<Answer>)> {
        match self.prompt {
            Prompt::None => None,
            Prompt::Close => Some((
                tr_with(
                    "Your last changes could not be saved to {0}: {1}. Closing now loses them.",
                    &[&self.store.dir().display(), &self.unsaved.reasons()],
                ),
                vec![
                    (tr("Close anyway"), tr("close anyway"), false),
                    (tr("Try again"), tr("try again"), true),
                    (tr("Stay"), tr("stay"), false),
                ],
            )),
            Prompt::LooseRule(rule) => Some((
                tr_with(
                    "{0} is an open-water rule: it keeps no gas to bring a teammate out of an overhead. Every turn goes down. Keep the rule of {1}?",
                    &[&rule.title(), &self.team.input().rule.shown_name()],
                ),
                vec![
                    (tr("Keep the rule"), tr("keep the rule"), true),
                    (tr("Use it anyway"), tr("use the open-water rule"), false),
                ],
            )),
            Prompt::Discard => {
                let name = self
                    .locker
                    .draft()
                    .map(|d| d.name.trim().to_string())
                    .filter(|n| !n.is_empty())
                    .unwrap_or_else(|| tr("the new set"));
                Some((
                    tr_with("Discard changes to {0}?", &[&name]),
                    vec![
                        (tr("Keep editing"), tr("keep editing"), true),
                        (tr("Discard"), tr("discard changes"), false),
                    ],
                ))
            }
        }
    }

    /// The answer at `idx` of `prompt_text`'s list.
    pub fn answer_prompt(&mut self, idx: usize) -> AfterPrompt {
        let prompt = std::mem::take(&mut self.prompt);
        match (prompt, idx) {
            (Prompt::Close, 0) => AfterPrompt::CloseWindow,
            (Prompt::Close, 1) => {
                if self.close_requested() {
                    AfterPrompt::CloseWindow
                } else {
                    AfterPrompt::Stay
                }
            }
            (Prompt::LooseRule(rule), 1) => {
                self.apply_rule(rule);
                AfterPrompt::Stay
            }
            (Prompt::Discard, 1) => {
                self.locker.drop_draft();
                if self.nav.current() == Screen::LockerEdit {
                    self.nav.back();
                }
                AfterPrompt::Stay
            }
            _ => AfterPrompt::Stay,
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::storage::Store;

    /// A data directory that cannot be written, even by root: its parent is a file.
    fn unwritable(tmp: &tempfile::TempDir) -> std::path::PathBuf {
        let blocker = tmp.path().join("blocker");
        std::fs::write(&blocker, "a file, not a folder").unwrap();
        blocker.join("data")
    }

    #[test]
    fn closing_with_unsaved_changes_asks_first() {
        let tmp = tempfile::tempdir().unwrap();
        let dir = tmp.path().join("data");
        let mut s = Session::open(Store::new(&dir));
        assert!(s.close_requested(), "all saved: close at once");
        let mut s = Session::open(Store::new(unwritable(&tmp)));
        s.acknowledge_cautions();
        assert!(!s.close_requested());
        assert_eq!(s.prompt, Prompt::Close);
        let (text, answers) = s.prompt_text().unwrap();
        assert!(text.starts_with("Your last changes could not be saved to"));
        assert!(text.contains("blocker"), "names the folder: {text}");
        assert_eq!(answers.len(), 3);
        assert_eq!(s.answer_prompt(2), AfterPrompt::Stay, "Stay");
        assert_eq!(s.prompt, Prompt::None);
        assert!(!s.close_requested());
        assert_eq!(s.answer_prompt(1), AfterPrompt::Stay, "Try again: fails");
        assert_eq!(s.prompt, Prompt::Close, "and asks again");
        assert_eq!(s.answer_prompt(0), AfterPrompt::CloseWindow, "Close anyway");
    }

    #[test]
    fn leaving_a_changed_locker_edit_asks_once() {
        let tmp = tempfile::tempdir().unwrap();
        let mut s = Session::open(Store::new(tmp.path()));
        s.acknowledge_cautions();
        s.go(Screen::Locker);
        s.locker_copy_preset(0);
        assert!(s.back(), "unchanged: leaves without asking");
        assert_eq!(s.page(), Screen::Locker);
        assert_eq!(s.prompt, Prompt::None);

        s.locker_copy_preset(0);
        s.locker.edit_draft(|d| d.name = "Cave twins".into());
        assert!(s.back());
        assert_eq!(s.prompt, Prompt::Discard);
        assert_eq!(s.page(), Screen::LockerEdit);
        assert_eq!(s.prompt_text().unwrap().0, "Discard changes to Cave twins?");
        // Back again answers "keep editing": one question, not a second one.
        assert!(s.back());
        assert_eq!(s.prompt, Prompt::None);
        assert_eq!(s.page(), Screen::LockerEdit);
        assert!(s.locker.draft().is_some());
        assert!(s.back());
        assert_eq!(s.answer_prompt(0), AfterPrompt::Stay, "Keep editing");
        assert_eq!(s.locker.draft().unwrap().name, "Cave twins");
        assert!(s.back());
        assert_eq!(s.answer_prompt(1), AfterPrompt::Stay, "Discard");
        assert!(s.locker.draft().is_none());
        assert_eq!(s.page(), Screen::Locker);
        assert!(s.locker.entries().is_empty(), "nothing was saved");
    }
}
