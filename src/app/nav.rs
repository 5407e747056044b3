//! Page history: what Back does.

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

#[cfg(test)]
mod tests {
    use super::*;

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
