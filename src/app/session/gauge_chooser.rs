//! The gauge chooser of a diver's card: every unit and graduation a gauge may have,
//! the current one marked. A tap on the card's gauge button only opens it, so a stray
//! tap never changes a gauge.

use crate::plan::{Gauge, PressureUnit};

use super::Session;

/// The gauges a diver may read, in the chooser's order.
pub const GAUGES: [Gauge; 4] = [
    Gauge {
        unit: PressureUnit::Bar,
        step: 10.0,
    },
    Gauge {
        unit: PressureUnit::Bar,
        step: 5.0,
    },
    Gauge {
        unit: PressureUnit::Psi,
        step: 100.0,
    },
    Gauge {
        unit: PressureUnit::Psi,
        step: 50.0,
    },
];

impl Session {
    /// Open the chooser for diver `i`.
    pub fn open_gauge_chooser(&mut self, i: usize) {
        if i < self.team.len() {
            self.gauge_chooser = Some(i);
        }
    }

    /// Close it without a change.
    pub fn close_gauge_chooser(&mut self) {
        self.gauge_chooser = None;
    }

    /// The choice at `idx` of `GAUGES` for the diver whose chooser is open.
    pub fn choose_gauge(&mut self, idx: usize) {
        if let (Some(i), Some(g)) = (self.gauge_chooser, GAUGES.get(idx)) {
            self.set_gauge(i, *g);
        }
        self.gauge_chooser = None;
    }
}

#[cfg(test)]
mod tests {
    use super::GAUGES;
    use crate::app::session::test_session as session;
    use crate::plan::PressureUnit;

    #[test]
    fn the_chooser_changes_a_gauge_only_on_a_choice_and_says_what_it_did() {
        let (_dir, mut s) = session();
        for i in 0..s.team.len() {
            s.confirm_start(i);
        }
        let before = s.team.to_state();
        let g = s.team.input().gauge_of(1);
        s.open_gauge_chooser(1);
        assert_eq!(s.team.to_state(), before, "opening changes nothing");
        assert!(s.back(), "Back closes the chooser");
        assert_eq!(s.gauge_chooser, None);
        // The other graduation of the same unit keeps the reading.
        let other = GAUGES
            .iter()
            .position(|c| c.unit == g.unit && c.step != g.step)
            .unwrap();
        s.open_gauge_chooser(1);
        s.choose_gauge(other);
        assert_eq!(s.gauge_chooser, None);
        assert_eq!(s.team.input().gauge_of(1), GAUGES[other]);
        let name = &s.team.input().divers[1].name;
        assert!(
            s.undo_text().starts_with(&format!("Gauge of {name} now")),
            "{}",
            s.undo_text()
        );
        s.undo();
        assert_eq!(s.team.to_state(), before);
        // The other unit: the reading is gone and the note says whose.
        let unit = GAUGES.iter().position(|c| c.unit != g.unit).unwrap();
        s.open_gauge_chooser(1);
        s.choose_gauge(unit);
        assert_ne!(s.team.input().gauge_of(1).unit, g.unit);
        assert!(
            s.undo_text().contains("No turns until"),
            "{}",
            s.undo_text()
        );
        assert!(matches!(
            GAUGES[unit].unit,
            PressureUnit::Bar | PressureUnit::Psi
        ));
    }
}
