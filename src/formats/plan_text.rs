//! The plan as plain text: what the QR code on the Turns page and the buddy view holds
//! and what "Copy plan as text" puts on the clipboard. One line per diver, short enough
//! for one QR code, in the screen's language and its decimal separator, with the words
//! the card and the Turns page use (the same catalogue messages). Our own symbols are
//! written in ASCII ([`ascii_friendly`]); letters of the language and names stay as they
//! are. No I/O here.

use crate::i18n::{tr, tr_with};
use crate::plan::shown;
use crate::plan::{TeamInput, TeamPlan, UnitSystem, Water};

/// What the text says besides the plan: when each start was read, which stage gauges
/// were read, and when the text was made.
#[derive(Clone, Debug, Default)]
pub struct PlanReads {
    /// "read 09:42" or "predicted 09:42" per diver, in team order, in the language of
    /// the text; empty when unknown.
    pub read_at: Vec<String>,
    /// Per diver: whether the stage start was read for this dive (a drop pressure is
    /// only written from one). Ignored for divers without a stage.
    pub stage_read: Vec<bool>,
    /// When the text was made ("2026-12-03 09:50"), if known.
    pub made: Option<String>,
}

/// The plan in plain text, in this thread's language with its decimal separator (the
/// screen's language in the app; each diver's phone shows its own words). Call it only
/// for a plan whose turns are shown (every start read for this dive): it writes the
/// turns without asking.
pub fn plan_text(team: &TeamInput, plan: &TeamPlan, reads: &PlanReads) -> String {
    let mut lines = Vec::new();
    lines.push(match &reads.made {
        Some(made) => tr_with("TURNSHEET team plan, {0}", &[made]),
        None => tr("TURNSHEET team plan"),
    });
    lines.push(rule_line(team));
    // Starts read at one time (the usual case on a dock) say it once, which keeps a
    // six-diver plan in one code in every language.
    let n = plan.divers.len();
    let common = reads.read_at.first().filter(|first| {
        !first.is_empty() && reads.read_at.len() == n && reads.read_at.iter().all(|r| r == *first)
    });
    if let Some(read) = common {
        lines.push(tr_with("Every start: {0}", &[read]));
    }
    let controllers: Vec<usize> = crate::plan::allowance_sources(team, plan)
        .iter()
        .map(|a| a.diver)
        .collect();
    for (i, d) in plan.divers.iter().enumerate() {
        let g = d.gauge;
        let unit = g.label();
        let start = shown::start(g.value(d.start));
        let own_read = reads
            .read_at
            .get(i)
            .filter(|r| !r.is_empty() && common.is_none());
        let mut parts = vec![match own_read {
            Some(read) => tr_with("start {0} {1} ({2})", &[&start, &unit, read]),
            None => tr_with("start {0} {1}", &[&start, &unit]),
        }];
        parts.push(tr_with(
            "TURN {0} {1}",
            &[&shown::turn(d.turn_shown_value), &unit],
        ));
        if let Some(st) = &d.stage {
            parts.push(if reads.stage_read.get(i).copied().unwrap_or(false) {
                tr_with(
                    "drop stage at {0} {1}",
                    &[&shown::turn(st.drop_shown_value), &unit],
                )
            } else {
                tr("stage: read its gauge")
            });
        }
        let mut line = tr_with("{0}: {1}", &[&d.name, &parts.join(", ")]);
        if controllers.contains(&i) {
            line = tr_with("{0} (controls)", &[&line]);
        }
        lines.push(line);
    }
    for w in plan.warning_texts() {
        lines.push(tr_with("WARNING: {0}", &[&w]));
    }
    // The card's caution line, in the same words.
    lines.push(tr(
        "Planning aid for trained divers. Team protocol, training and site rules come first. Check by hand.",
    ));
    ascii_friendly(&lines.join("\n"))
}

/// "Rule of thirds, fresh water 12 C, 30 m": the rule, the water, its temperature
/// to the nearest degree and the depth (if given, rounded down), as the card says them.
fn rule_line(team: &TeamInput) -> String {
    let u = team.units;
    let degrees = shown::degrees(u.temperature_value(team.water_temp));
    let water = match team.water {
        Water::Fresh => tr_with("fresh water {0} {1}", &[&degrees, &u.temperature_label()]),
        Water::Salt => tr_with("salt water {0} {1}", &[&degrees, &u.temperature_label()]),
    };
    let depth = team
        .depth
        .map(|d| {
            let v = match u {
                UnitSystem::Metric => d.metres(),
                UnitSystem::Imperial => d.feet(),
            };
            format!(", {} {}", shown::start(v), u.depth_label())
        })
        .unwrap_or_default();
    format!("{}, {water}{depth}", team.rule.rule_of())
}

/// Our own symbols in ASCII: "÷" → "/", "°C" → "C", "×" → "x", "→" → "->", "·" → ",",
/// no-break spaces → spaces. They cost two or three bytes each in the code and a
/// phone's reader may show them as boxes; plain text has no line ends to guard, so a
/// space does. Letters of every language and names as typed are kept (UTF-8, which
/// phone camera apps read).
pub fn ascii_friendly(text: &str) -> String {
    let text = text.replace(" · ", ", ");
    let mut out = String::with_capacity(text.len());
    for c in text.chars() {
        match c {
            '÷' => out.push('/'),
            '°' => {}
            '×' => out.push('x'),
            '→' => out.push_str("->"),
            '·' => out.push(','),
            '…' => out.push_str("..."),
            '–' | '—' | '−' => out.push('-'),
            '\u{a0}' | '\u{202f}' => out.push(' '),
            c => out.push(c),
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::formats::card_svg::CAUTION;
    use crate::formats::team_file::TeamFile;
    use crate::i18n::{Language, LanguageScope};
    use crate::plan::plan_team;

    fn demo() -> (TeamInput, TeamPlan) {
        let file: TeamFile =
            serde_json::from_str(include_str!("../../examples/hollowmere-team.json")).unwrap();
        let input = file.to_input().unwrap();
        let plan = plan_team(&input).unwrap();
        (input, plan)
    }

    #[test]
    fn every_diver_has_start_read_time_and_turn() {
        let _en = LanguageScope::new(Language::English);
        let (input, plan) = demo();
        let n = input.divers.len();
        let reads = PlanReads {
            read_at: (0..n).map(|i| format!("read 09:4{i}")).collect(),
            stage_read: vec![true; n],
            made: Some("3 Dec 2026 09:50".into()),
        };
        let text = plan_text(&input, &plan, &reads);
        for (i, d) in plan.divers.iter().enumerate() {
            let line = text
                .lines()
                .find(|l| l.starts_with(&format!("{}:", d.name)))
                .unwrap_or_else(|| panic!("no line for {}:\n{text}", d.name));
            let unit = d.gauge.label();
            assert!(line.contains(&format!("(read 09:4{i})")), "{line}");
            assert!(
                line.contains(&format!("TURN {} {unit}", shown::turn(d.turn_shown_value))),
                "{line}"
            );
            if let Some(st) = &d.stage {
                assert!(
                    line.contains(&format!(
                        "drop stage at {}",
                        shown::turn(st.drop_shown_value)
                    )),
                    "{line}"
                );
            }
        }
        assert!(text.contains("Rule of thirds"), "{text}");
        assert!(text.contains(CAUTION), "{text}");
        let controls = crate::plan::allowance_sources(&input, &plan)[0].diver;
        let name = &plan.divers[controls].name;
        assert!(
            text.lines()
                .any(|l| l.starts_with(&format!("{name}:")) && l.ends_with("(controls)")),
            "{text}"
        );
        assert!(!text.contains('÷') && !text.contains('°'), "{text}");
    }

    #[test]
    fn starts_read_at_one_time_say_it_once() {
        let _en = LanguageScope::new(Language::English);
        let (input, plan) = demo();
        let n = input.divers.len();
        let reads = PlanReads {
            read_at: vec!["read 09:42".into(); n],
            stage_read: vec![true; n],
            made: None,
        };
        let text = plan_text(&input, &plan, &reads);
        assert_eq!(text.matches("read 09:42").count(), 1, "{text}");
        assert!(text.contains("Every start: read 09:42"), "{text}");
    }

    #[test]
    fn an_unread_stage_gets_no_drop_pressure() {
        let _en = LanguageScope::new(Language::English);
        let (input, plan) = demo();
        let reads = PlanReads::default();
        let text = plan_text(&input, &plan, &reads);
        assert!(!text.contains("drop stage at"), "{text}");
        assert!(text.contains("stage: read its gauge"), "{text}");
    }

    #[test]
    fn our_symbols_fold_to_ascii_and_names_stay() {
        assert_eq!(
            ascii_friendly("4237 L (Zoë) ÷ 3 · 12 °C → 2 × 5"),
            "4237 L (Zoë) / 3, 12 C -> 2 x 5"
        );
    }

    #[test]
    fn the_text_speaks_the_screen_language_with_its_decimals() {
        let (input, mut plan) = demo();
        // A turn on a 2.5 bar graduation, so the text holds a decimal.
        plan.divers[0].turn_shown_value = 162.5;
        let reads = PlanReads {
            read_at: vec![String::new(); input.divers.len()],
            stage_read: vec![true; input.divers.len()],
            made: Some("2026-12-03 09:50".into()),
        };
        let english = {
            let _en = LanguageScope::new(Language::English);
            plan_text(&input, &plan, &reads)
        };
        assert!(english.contains("TURN 162.5 bar"), "{english}");
        for l in Language::ALL.into_iter().skip(1) {
            let _scope = LanguageScope::new(l);
            let text = plan_text(&input, &plan, &reads);
            assert!(text.contains("162,5"), "{l:?}: {text}");
            assert!(!text.contains("162.5"), "{l:?}: {text}");
            // Every line but the names and numbers is in the language: none equals the
            // English line.
            for (ours, en) in text.lines().zip(english.lines()) {
                assert_ne!(ours, en, "{l:?}: an English line");
            }
            assert!(
                text.contains(&ascii_friendly(&tr(
                    "Planning aid for trained divers. Team protocol, training and site rules come first. Check by hand."
                ))),
                "{l:?}: {text}"
            );
        }
    }
}
