//! Navigation and status: the page history (what Back does) and the messages shown
//! until the person dismisses them.

#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Screen {
    Cautions,
    Team,
    Turns,
    Buddy,
    Locker,
    LockerEdit,
    Settings,
    Fill,
    Chart,
}

#[derive(Clone, Debug)]
pub struct NavController {
    stack: Vec<Screen>,
}

impl NavController {
    pub fn new(first: Screen) -> Self {
        NavController { stack: vec![first] }
    }
    pub fn current(&self) -> Screen {
        *self.stack.last().unwrap_or(&Screen::Team)
    }
    pub fn go(&mut self, s: Screen) {
        if self.current() != s {
            self.stack.push(s);
        }
    }
    /// Replace the whole history with one page.
    pub fn reset(&mut self, s: Screen) {
        self.stack = vec![s];
    }
    /// Pop one page; false when this is the last page (the system may close the app).
    pub fn back(&mut self) -> bool {
        if self.stack.len() > 1 {
            self.stack.pop();
            true
        } else {
            false
        }
    }
}

/// Messages for the person (files that could not be read, edits that were refused),
/// shown together until dismissed.
#[derive(Clone, Debug, Default, PartialEq)]
pub struct Status {
    messages: Vec<String>,
}

impl Status {
    pub fn new(messages: Vec<String>) -> Self {
        Status { messages }
    }
    pub fn push(&mut self, message: impl Into<String>) {
        self.messages.push(message.into());
    }
    /// Keep the message of a failed result.
    pub fn report<E: std::fmt::Display>(&mut self, r: Result<(), E>) {
        if let Err(e) = r {
            self.push(e.to_string());
        }
    }
    pub fn clear(&mut self) {
        self.messages.clear();
    }
    pub fn iter(&self) -> std::slice::Iter<'_, String> {
        self.messages.iter()
    }
    /// All messages, one a line; empty when there are none.
    pub fn text(&self) -> String {
        self.messages.join("\n")
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn status_keeps_failures_until_dismissed() {
        let mut s = Status::new(vec!["first".into()]);
        s.report(Ok::<(), String>(()));
        s.report(Err::<(), String>("second".into()));
        assert_eq!(s.text(), "first\nsecond");
        s.clear();
        assert_eq!(s.text(), "");
    }

    #[test]
    fn back_walks_the_history_and_stops_at_the_root() {
        let mut n = NavController::new(Screen::Team);
        n.go(Screen::Turns);
        n.go(Screen::Buddy);
        assert!(n.back());
        assert_eq!(n.current(), Screen::Turns);
        assert!(n.back());
        assert!(!n.back());
        assert_eq!(n.current(), Screen::Team);
    }
}
