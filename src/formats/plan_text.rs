//! The plan as plain text: what the QR code on the Turns page and the buddy view holds
//! and what "Copy plan as text" puts on the clipboard. One line per diver, short enough
//! for one QR code, in the words the card and the Turns page use. Our own symbols are
//! written in ASCII (a phone that reads the code may not show "÷" or "°"); names stay as
//! the divers typed them. No I/O here.

use crate::plan::shown;
use crate::plan::{TeamInput, TeamPlan, UnitSystem, Water};

use super::card_svg::CAUTION;

/// What the text says besides the plan: when each start was read, which stage gauges
/// were read, and when the text was made.
#[derive(Clone, Debug, Default)]
pub struct PlanReads {
    /// "read 09:42" or "predicted 09:42" per diver, in team order; empty when unknown.
    pub read_at: Vec<String>,
    /// Per diver: whether the stage start was read for this dive (a drop pressure is
    /// only written from one). Ignored for divers without a stage.
    pub stage_read: Vec<bool>,
    /// When the text was made ("3 Dec 2026 09:50"), if known.
    pub made: Option<String>,
}

/// The plan in plain text. Call it only for a plan whose turns are shown (every start
/// read for this dive): it writes the turns without asking. Always in English with a
/// decimal point, whatever the screen's language, so any teammate's phone reads the same
/// text (translating it is left for later).
pub fn plan_text(team: &TeamInput, plan: &TeamPlan, reads: &PlanReads) -> String {
    let _english = crate::i18n::LanguageScope::new(crate::i18n::Language::English);
    let mut lines = Vec::new();
    lines.push(match &reads.made {
        Some(made) => format!("TURNSHEET team plan, {made}"),
        None => "TURNSHEET team plan".to_string(),
    });
    lines.push(rule_line(team));
    let controllers: Vec<usize> = crate::plan::allowance_sources(team, plan)
        .iter()
        .map(|a| a.diver)
        .collect();
    for (i, d) in plan.divers.iter().enumerate() {
        let g = d.gauge;
        let unit = g.label();
        let mut line = format!(
            "{}: start {} {unit}",
            d.name,
            shown::start(g.value(d.start))
        );
        if let Some(read) = reads.read_at.get(i).filter(|r| !r.is_empty()) {
            line += &format!(" ({read})");
        }
        line += &format!(", TURN {} {unit}", shown::turn(d.turn_shown_value));
        if let Some(st) = &d.stage {
            if reads.stage_read.get(i).copied().unwrap_or(false) {
                line += &format!(
                    ", drop stage at {} {unit}",
                    shown::turn(st.drop_shown_value)
                );
            } else {
                line += ", stage: read its gauge";
            }
        }
        if controllers.contains(&i) {
            line += " (controls)";
        }
        lines.push(line);
    }
    lines.push(crate::plan::allowance_source_sentence(team, plan));
    for w in plan.warning_texts() {
        lines.push(format!("WARNING: {w}"));
    }
    lines.push(CAUTION.to_string());
    ascii_friendly(&lines.join("\n"))
}

/// "Rule of thirds, fresh water 12 C, 30 m": the rule, the water, its temperature
/// to the nearest degree and the depth (if given, rounded down).
fn rule_line(team: &TeamInput) -> String {
    let u = team.units;
    let water = match team.water {
        Water::Fresh => "fresh",
        Water::Salt => "salt",
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
    format!(
        "Rule of {}, {water} water {} {}{depth}",
        team.rule.name(),
        shown::degrees(u.temperature_value(team.water_temp)),
        u.temperature_label()
    )
}

/// Our own symbols in ASCII: "÷" → "/", "°C" → "C", "×" → "x", "→" → "->", "·" → ",",
/// no-break spaces → spaces. Everything else (names as typed) is kept.
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
    use crate::formats::team_file::TeamFile;
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
        assert!(text.contains(" controls: least usable gas"), "{text}");
        assert!(!text.contains('÷') && !text.contains('°'), "{text}");
    }

    #[test]
    fn an_unread_stage_gets_no_drop_pressure() {
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
}
