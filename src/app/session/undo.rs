//! One step back after a change that throws away a diver or a whole team: removing a
//! diver and starting a new team. The offer lasts until the team changes again.

use crate::i18n::tr_with;
use crate::storage::team_state::TeamState;

use super::super::team_controller::TeamController;
use super::{ChartPair, FillCheck, Session};

/// What Undo puts back, and the words that offer it.
pub struct UndoOffer {
    text: String,
    team: TeamState,
}

impl Session {
    /// "Bram removed." while Undo is offered; empty otherwise.
    pub fn undo_text(&self) -> &str {
        self.undo.as_ref().map(|u| u.text.as_str()).unwrap_or("")
    }

    /// Offer Undo for a change just made and saved; `before` is the team before it.
    pub(super) fn offer_undo(&mut self, text: String, before: TeamState) {
        self.undo = Some(UndoOffer { text, team: before });
    }

    /// Put the team back as it was before the change on offer (its divers, cylinders,
    /// starts and when they were read) and save it.
    pub fn undo(&mut self) {
        let Some(offer) = self.undo.take() else {
            return;
        };
        match TeamController::from_state(&offer.team) {
            Ok(team) => {
                self.team = team;
                self.fill = FillCheck::for_team(self.team.input());
                self.chart = ChartPair::default();
                self.save_team();
            }
            Err(e) => self.status.push(tr_with("Undo failed: {0}", &[&e])),
        }
    }
}

#[cfg(test)]
mod tests {
    use crate::app::readings::StartStatus;
    use crate::app::session::Session;
    use crate::storage::Store;

    use crate::app::session::test_session as session;

    #[test]
    fn removing_a_diver_can_be_undone_with_the_reading_kept() {
        let (dir, mut s) = session();
        s.confirm_start(1);
        let before = s.team.to_state();
        let name = s.team.input().divers[1].name.clone();
        s.remove_diver(1);
        assert_eq!(s.team.len(), before.team.divers.len() - 1);
        assert_eq!(s.undo_text(), format!("{name} removed."));
        s.undo();
        assert_eq!(s.team.to_state().team, before.team);
        assert_eq!(s.team.input().divers[1].name, name);
        let now = s.now();
        assert_eq!(s.team.start_status(1, now), StartStatus::Fresh);
        assert_eq!(s.undo_text(), "", "one undo only");
        // What is on disk is the team as it was.
        let reopened = Session::open(Store::new(dir.path()));
        assert_eq!(reopened.team.to_state().team, before.team);
    }

    #[test]
    fn a_new_team_can_be_undone_until_the_team_changes() {
        let (_dir, mut s) = session();
        let before = s.team.to_state();
        s.new_team();
        assert!(s.undo_text().contains("New team"), "{}", s.undo_text());
        s.undo();
        assert_eq!(s.team.to_state().team, before.team);

        s.new_team();
        s.toggle_water();
        assert_eq!(s.undo_text(), "", "an edit after the change ends the offer");
        let edited = s.team.to_state();
        s.undo();
        assert_eq!(s.team.to_state().team, edited.team, "nothing to undo");
    }
}
