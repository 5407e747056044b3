//! The team card: one notebook page (100 × 150 mm) or slate, as SVG text. Black on white,
//! large turn figures, no colour needed to read it. Optional following pages carry each
//! diver's pairing charts. No I/O here: the caller writes the text.

use crate::i18n::{tr, tr_with};
use crate::plan::shown;
use crate::plan::{PairChart, SetLabels, TeamInput, TeamPlan};

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
    /// What the divers called their sets; each is written by its one name
    /// (`plan::set_name`), as the app and `plan` write it.
    pub labels: SetLabels,
}

/// Size of a diver's turn figure, mm.
const TURN_SIZE: f64 = 8.5;
/// Mean advance of a character, in ems: Roboto's letters average under half an em (the
/// demo card's lines measured 0.44 to 0.47 em in its rendering, our own measurement); its
/// bold digits are about 0.56 em. Rounded up, so an estimate is never short.
const TEXT_EM: f64 = 0.48;
const BOLD_DIGIT_EM: f64 = 0.58;

/// How wide `text` is estimated to be at `size` mm.
fn estimated_width(text: &str, size: f64, em: f64) -> f64 {
    text.chars().count() as f64 * size * em
}

/// `text` in lines that fit `width` mm at `size` mm: wrapped at spaces into at most
/// `max_lines` lines, and made smaller (not under 60 %) while it would still run over.
fn fit(text: &str, width: f64, size: f64, max_lines: usize) -> (Vec<String>, f64) {
    let mut s = size;
    loop {
        let per_line = (width / (s * TEXT_EM)).floor().max(1.0) as usize;
        let lines = wrap(text, per_line);
        let fits = lines.len() <= max_lines && lines.iter().all(|l| l.chars().count() <= per_line);
        if fits || s < size * 0.6 {
            return (lines, s);
        }
        s *= 0.95;
    }
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
        // The set's line ends before the turn figure beside it.
        let turn = format!("{} {}", shown::turn(d.turn_shown_value), g.label());
        let beside = right - estimated_width(&turn, TURN_SIZE, BOLD_DIGIT_EM) - 2.0;
        let set = heading.labels.set_name(team, i);
        let (set, size) = fit(&set, beside - MARGIN, 2.8, 1);
        p.text(MARGIN, top + 8.3, size, false, "start", &set.join(" "));
        p.text(
            MARGIN,
            top + 11.8,
            2.8,
            false,
            "start",
            &format!(
                "{} · {}",
                inp.mix.label(),
                match heading.read_at.get(i).filter(|r| !r.is_empty()) {
                    Some(read) => tr_with(
                        "start {0} {1} ({2})",
                        &[&shown::start(g.value(d.start)), &g.label(), read],
                    ),
                    None => tr_with(
                        "start {0} {1}",
                        &[&shown::start(g.value(d.start)), &g.label()],
                    ),
                }
            ),
        );
        p.text(right - 38.0, top + 4.3, 2.6, false, "end", &tr("TURN"));
        p.text(right, top + 10.5, TURN_SIZE, true, "end", &turn);
        if let (Some(st), Some(si), Some(stage_name)) =
            (&d.stage, &inp.stage, heading.labels.stage_name(team, i))
        {
            let drop = tr_with(
                "drop stage at {0} {1} ({2}, {3}, start {4} {1})",
                &[
                    &shown::turn(st.drop_shown_value),
                    &g.label(),
                    &stage_name,
                    &si.mix.label(),
                    &shown::start(g.value(st.start)),
                ],
            );
            // A second line where the diver's block has room for it, else smaller type.
            let room = if block >= 15.3 + 3.3 + 1.5 { 2 } else { 1 };
            let (lines, size) = fit(&drop, right - MARGIN, 2.8, room);
            for (k, line) in lines.iter().enumerate() {
                let at = top + 15.3 + k as f64 * size * 1.18;
                p.text(MARGIN, at, size, true, "start", line);
            }
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
