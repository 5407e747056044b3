//! The stage line of a diver's turn card: where the stage is dropped, or why not yet.

use super::super::session::Session;
use super::reading;
use crate::app::readings::{StartStatus, when_text};
use crate::i18n::tr_with;
use crate::plan::shown::turn as turn_text;

/// "Drop stage at 140 bar (Single aluminium 40 cu ft 3000 psi, EAN32, start 200 bar)" for a diver with a
/// stage, else empty.
pub fn stage_text(s: &Session, i: usize) -> String {
    let plan = s.team.plan();
    let g = plan.divers[i].gauge;
    let name = &plan.divers[i].name;
    // A drop pressure only from a stage start read today.
    match s.team.stage_status(i, s.now()) {
        Some(StartStatus::Missing) => {
            return tr_with(
                "Stage drop: read the stage gauge of {0} in the water first.",
                &[name],
            );
        }
        Some(StartStatus::Old { at }) => {
            return tr_with(
                "Stage drop: the stage start was entered {0}; read the stage gauge again.",
                &[&when_text(at, s.now())],
            );
        }
        _ => {}
    }
    match (&plan.divers[i].stage, &s.team.input().divers[i].stage) {
        (Some(st), Some(si)) => {
            let args: [&dyn std::fmt::Display; 6] = [
                &turn_text(st.drop_shown_value),
                &g.label(),
                &s.team.shown_stage_label(i),
                &si.mix.label(),
                &reading(g, st.start),
                &st.set_by.describe(),
            ];
            if st.controlling {
                tr_with(
                    "Drop stage at {0} {1} ({2}, {3}, start {4} {1}; set by {5}). This stage has the least usable gas and sets every stage's drop.",
                    &args,
                )
            } else {
                tr_with(
                    "Drop stage at {0} {1} ({2}, {3}, start {4} {1}; set by {5})",
                    &args,
                )
            }
        }
        _ => String::new(),
    }
}
