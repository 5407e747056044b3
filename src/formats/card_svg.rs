//! The team card: one notebook page (100 × 150 mm) or slate, as SVG text. Black on white,
//! large turn figures, no colour needed to read it. Optional following pages carry each
//! diver's pairing charts. No I/O here: the caller writes the text.

use crate::i18n::{tr, tr_with};
use crate::plan::shown;
use crate::plan::{PairChart, TeamInput, TeamPlan};

pub use super::svg_page::{FONT, PAGE_H, PAGE_W, wrap, xml_escape};
use super::svg_page::{MARGIN, Page, svg_of};

pub use super::chart_svg::charts_svg;
/// The card's caution line in English, as the plan as text carries it (the card itself
/// shows it in the language on screen).
pub const CAUTION: &str = "Planning aid for trained divers. Team protocol, training and site rules come first. Check by hand.";

/// What goes on top of the card besides the plan.
#[derive(Clone, Debug, Default)]
pub struct CardHeading {
    /// The dive's name, if given.
    pub dive: Option<String>,
    /// The date, as the user wrote it, if given.
    pub date: Option<String>,
    /// When each diver's start was read ("read 09:42"), in team order; empty when not
    /// known (the command line plans from a file).
    pub read_at: Vec<String>,
}

/// The card page for a planned team.
fn card_page(heading: &CardHeading, team: &TeamInput, plan: &TeamPlan) -> Page {
    let u = team.units;
    let mut p = Page::new();
    let right = PAGE_W - MARGIN;
    let mut y = MARGIN + 5.0;
    let title = heading
        .dive
        .clone()
        .unwrap_or_else(|| tr("Team turn pressures"));
    let title: String = if title.chars().count() > 34 {
        title.chars().take(33).collect::<String>() + "…"
    } else {
        title
    };
    p.text(MARGIN, y, 5.0, true, "start", &title);
    y += 5.0;
    if let Some(date) = &heading.date {
        p.text(right, y, 3.2, true, "end", date);
    }
    let depth = team
        .depth
        .map(|d| {
            format!(
                ", {} {}",
                shown::start(match u {
                    crate::plan::UnitSystem::Metric => d.metres(),
                    crate::plan::UnitSystem::Imperial => d.feet(),
                }),
                u.depth_label()
            )
        })
        .unwrap_or_default();
    let degrees = shown::degrees(u.temperature_value(team.water_temp));
    let water = match team.water {
        crate::plan::Water::Fresh => {
            tr_with("fresh water {0} {1}", &[&degrees, &u.temperature_label()])
        }
        crate::plan::Water::Salt => {
            tr_with("salt water {0} {1}", &[&degrees, &u.temperature_label()])
        }
    };
    let conditions = format!("{} · {water}{depth}", team.rule.rule_of());
    p.text(MARGIN, y, 3.2, false, "start", &conditions);
    y += 2.5;
    p.line(MARGIN, y, right, y, 0.4);

    let n = plan.divers.len().max(1) as f64;
    let block = ((PAGE_H - y - 38.0) / n).clamp(15.0, 24.0);
    let controllers: Vec<usize> = crate::plan::allowance_sources(team, plan)
        .iter()
        .map(|a| a.diver)
        .collect();
    for (i, d) in plan.divers.iter().enumerate() {
        let inp = &team.divers[i];
        let g = d.gauge;
        let top = y + block * i as f64;
        let name = if controllers.contains(&i) {
            tr_with("{0} (controls)", &[&d.name])
        } else {
            d.name.clone()
        };
        p.text(MARGIN, top + 4.5, 3.8, true, "start", &name);
        p.text(
            MARGIN,
            top + 8.3,
            2.8,
            false,
            "start",
            &format!("{} · {}", inp.cylinders.describe(), inp.mix.label()),
        );
        p.text(
            MARGIN,
            top + 11.8,
            2.8,
            false,
            "start",
            &match heading.read_at.get(i).filter(|r| !r.is_empty()) {
                Some(read) => tr_with(
                    "start {0} {1} ({2})",
                    &[&shown::start(g.value(d.start)), &g.label(), read],
                ),
                None => tr_with(
                    "start {0} {1}",
                    &[&shown::start(g.value(d.start)), &g.label()],
                ),
            },
        );
        p.text(right - 38.0, top + 4.3, 2.6, false, "end", &tr("TURN"));
        p.text(
            right,
            top + 10.5,
            8.5,
            true,
            "end",
            &format!("{} {}", shown::turn(d.turn_shown_value), g.label()),
        );
        if let (Some(st), Some(si)) = (&d.stage, &inp.stage) {
            p.text(
                MARGIN,
                top + 15.3,
                2.8,
                true,
                "start",
                &tr_with(
                    "drop stage at {0} {1} ({2}, {3}, start {4} {1})",
                    &[
                        &shown::turn(st.drop_shown_value),
                        &g.label(),
                        &si.cylinders.describe(),
                        &si.mix.label(),
                        &shown::start(g.value(st.start)),
                    ],
                ),
            );
        }
        p.line(MARGIN, top + block, right, top + block, 0.2);
    }
    let mut y = y + block * n + 4.0;
    // The core's warnings first, in the words the app and `plan` use.
    let warnings = plan.warning_texts().into_iter();
    let mut notes: Vec<String> = warnings.map(|w| tr_with("WARNING: {0}", &[&w])).collect();
    notes.push(crate::plan::allowance_source_sentence(team, plan));
    if plan.stress.margin.is_finite() {
        // The same verdict-first words as the app and `plan`.
        notes.push(tr_with(
            "Out of gas at the turn: {0}",
            &[&plan.margin_text()],
        ));
    }
    notes.push(tr(
        "Turn when the FIRST diver reaches their turn, or at any other limit.",
    ));
    for note in notes {
        for line in wrap(&note, 68) {
            p.text(MARGIN, y, 2.6, false, "start", &line);
            y += 3.3;
        }
        y += 0.8;
    }
    let caution = tr(
        "Planning aid for trained divers. Team protocol, training and site rules come first. Check by hand.",
    );
    let mut cy = PAGE_H - MARGIN - 3.3 * wrap(&caution, 72).len() as f64 + 2.5;
    p.line(MARGIN, cy - 3.2, right, cy - 3.2, 0.3);
    for line in wrap(&caution, 72) {
        p.text(MARGIN, cy, 2.4, false, "start", &line);
        cy += 3.3;
    }
    p
}

/// The card as SVG text: the card page, then one page per pairing chart, stacked top to
/// bottom (each 100 × 150 mm, separated by a cut line).
pub fn card_svg(
    heading: &CardHeading,
    team: &TeamInput,
    plan: &TeamPlan,
    charts: &[PairChart],
) -> String {
    let mut pages = vec![card_page(heading, team, plan)];
    pages.extend(charts.iter().map(|c| super::chart_svg::chart_page(team, c)));
    svg_of(
        &pages,
        &tr_with("Team card: {0}", &[&plan.names().join(", ")]),
    )
}
