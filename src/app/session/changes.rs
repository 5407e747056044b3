//! A change to the plan, said in words, with Undo. Once the turns are shown, every
//! control that changes them (rule, gauge step, water, depth, a diver's gauge,
//! cylinders, mix, a diver removed, units) says what it did to each turn ("Rule now
//! halves. Turns: Ines 160 → 120 bar, …") and offers Undo, the same Undo as removing a
//! diver. A rule that does not suit an overhead dive asks first.

use crate::i18n::tr_with;
use crate::plan::InputError;
use crate::plan::{Rule, TeamPlan};
use crate::storage::team_state::TeamState;

use super::super::team_controller::TeamController;
use super::{Prompt, Session};
use crate::plan::shown;

/// The team before a change and the turns it showed (None while turns were hidden).
pub(super) struct Before {
    state: TeamState,
    turns: Option<Vec<(String, String)>>,
}

/// Each diver's shown turn with its unit ("160 bar"), by name.
fn turns_of(plan: &TeamPlan) -> Vec<(String, String)> {
    plan.divers
        .iter()
        .map(|d| {
            (
                d.name.clone(),
                format!("{} {}", shown::turn(d.turn_shown_value), d.gauge.label()),
            )
        })
        .collect()
}

impl Session {
    /// The team now and the turns it shows, to compare after a change.
    pub(super) fn before_change(&self) -> Before {
        Before {
            state: self.team.to_state(),
            turns: self
                .team
                .turns_ready(self.now)
                .then(|| turns_of(self.team.plan())),
        }
    }

    /// After a change was made and saved: offer Undo with `headline` and what became of
    /// each turn, when turns were shown before and the team changed. Nothing otherwise.
    pub(super) fn after_change(&mut self, headline: String, before: Before) {
        if before.state == self.team.to_state() {
            return;
        }
        let Some(old) = before.turns else {
            return;
        };
        let text = tr_with("{0}. {1}", &[&headline, &self.turn_changes(&old)]);
        self.offer_undo(text, before.state);
    }

    /// "Turns: Ines 160 → 120 bar, Sol 140 bar (same)." or why none are shown now.
    fn turn_changes(&self, old: &[(String, String)]) -> String {
        if !self.team.turns_ready(self.now) {
            let names: Vec<&str> = self
                .team
                .readings()
                .blocking(self.now)
                .into_iter()
                .filter_map(|i| self.team.input().divers.get(i).map(|d| d.name.as_str()))
                .collect();
            return tr_with(
                "No turns until the start of {0} is read again.",
                &[&names.join(", ")],
            );
        }
        let parts: Vec<String> = turns_of(self.team.plan())
            .into_iter()
            .map(|(name, new)| match old.iter().find(|(n, _)| *n == name) {
                Some((_, was)) if *was == new => tr_with("{0} {1} (same)", &[&name, &new]),
                Some((_, was)) => {
                    // "160 bar" → "120 bar": say the unit once when it stays.
                    let (was_n, was_u) = was.split_once(' ').unwrap_or((was, ""));
                    let (new_n, new_u) = new.split_once(' ').unwrap_or((&new, ""));
                    if was_u == new_u {
                        format!("{name} {was_n} → {new_n} {new_u}")
                    } else {
                        format!("{name} {was} → {new}")
                    }
                }
                None => format!("{name} {new}"),
            })
            .collect();
        tr_with("Turns: {0}.", &[&parts.join(", ")])
    }

    /// Make a change through the team controller, save it or report why it was
    /// refused, and say what it did to the turns.
    pub(super) fn change_plan(
        &mut self,
        edit: impl FnOnce(&mut TeamController) -> Result<(), InputError>,
        headline: impl FnOnce(&Session) -> String,
    ) {
        let before = self.before_change();
        let r = edit(&mut self.team);
        let ok = r.is_ok();
        self.team_result(r);
        if ok {
            let h = headline(self);
            self.after_change(h, before);
        }
    }

    /// The rule chooser. A rule that does not suit an overhead dive (halves) asks
    /// first; the rest change at once.
    pub fn set_rule(&mut self, idx: usize) {
        let Some(rule) = Rule::ALL.get(idx).copied() else {
            return;
        };
        if rule == self.team.input().rule {
            return;
        }
        if !rule.fit_for_overhead() {
            self.prompt = Prompt::LooseRule(rule);
            return;
        }
        self.apply_rule(rule);
    }

    /// Use `rule` now (after the question, for halves).
    pub(super) fn apply_rule(&mut self, rule: Rule) {
        self.change_plan(
            |t| t.set_rule(rule),
            |s| tr_with("Rule now {0}", &[&s.team.input().rule.shown_name()]),
        );
    }
}

#[cfg(test)]
mod tests {
    use crate::app::session::test_session as session;
    use crate::app::session::{Prompt, Session};
    use crate::plan::Rule;

    fn read_all(s: &mut Session) {
        for i in 0..s.team.len() {
            s.confirm_start(i);
        }
    }

    fn rule_index(rule: Rule) -> usize {
        Rule::ALL.iter().position(|r| *r == rule).unwrap()
    }

    #[test]
    fn a_rule_change_says_every_turn_it_moved_and_undoes() {
        let (_dir, mut s) = session();
        read_all(&mut s);
        let before = s.team.to_state();
        let old: Vec<f64> = s
            .team
            .plan()
            .divers
            .iter()
            .map(|d| d.turn_shown_value)
            .collect();
        s.set_rule(rule_index(Rule::Quarters));
        let text = s.undo_text().to_string();
        assert!(text.starts_with("Rule now quarters. Turns: "), "{text}");
        for (d, was) in s.team.plan().divers.iter().zip(&old) {
            let now = d.turn_shown_value;
            assert!(now >= *was, "a stricter rule never lowers a turn");
            let said = if now == *was {
                format!("{} {} {} (same)", d.name, now, d.gauge.label())
            } else {
                format!("{} {} → {} {}", d.name, was, now, d.gauge.label())
            };
            assert!(text.contains(&said), "{said} in {text}");
        }
        s.undo();
        assert_eq!(s.team.to_state(), before);
    }

    #[test]
    fn halves_asks_first_and_keeps_thirds_unless_chosen() {
        let (_dir, mut s) = session();
        read_all(&mut s);
        let halves = rule_index(Rule::Halves);
        s.set_rule(halves);
        assert_eq!(s.prompt, Prompt::LooseRule(Rule::Halves));
        assert_eq!(s.team.input().rule, Rule::Thirds, "nothing changed yet");
        let (question, answers) = s.prompt_text().unwrap();
        assert!(question.contains("overhead"), "{question}");
        assert!(answers[0].2, "keeping the rule is the stressed answer");
        s.answer_prompt(0);
        assert_eq!(s.team.input().rule, Rule::Thirds);
        s.set_rule(halves);
        s.answer_prompt(1);
        assert_eq!(s.team.input().rule, Rule::Halves);
        assert!(
            s.undo_text().starts_with("Rule now halves"),
            "{}",
            s.undo_text()
        );
    }

    #[test]
    fn depth_water_and_mix_say_what_they_changed() {
        use crate::app::session::EntryTarget;
        let (_dir, mut s) = session();
        read_all(&mut s);
        s.open_entry(EntryTarget::Depth);
        for k in ["clear", "3", "0"] {
            s.key(k);
        }
        s.entry_done();
        assert!(
            s.undo_text().starts_with("Depth now 30"),
            "{}",
            s.undo_text()
        );
        assert!(s.undo_text().contains("(same)"), "depth moves no turn");
        s.toggle_water();
        assert!(s.undo_text().starts_with("Water now "), "{}", s.undo_text());
        let before = s.team.to_state();
        s.open_mix_picker(1);
        s.picker.set_mix_percent(Some(36), Some(0));
        s.mix_done();
        let name = &s.team.input().divers[1].name;
        assert!(
            s.undo_text()
                .starts_with(&format!("Mix of {name} now EAN36")),
            "{}",
            s.undo_text()
        );
        s.undo();
        assert_eq!(s.team.to_state(), before);
        // A cancelled entry says nothing.
        s.open_entry(EntryTarget::Depth);
        s.key("5");
        s.cancel_entry();
        assert_eq!(s.undo_text(), "");
    }

    #[test]
    fn before_the_starts_are_read_a_change_offers_no_undo() {
        let (_dir, mut s) = session();
        s.set_rule(rule_index(Rule::Quarters));
        assert_eq!(s.team.input().rule, Rule::Quarters);
        assert_eq!(s.undo_text(), "", "no turns were shown, none changed");
    }
}
