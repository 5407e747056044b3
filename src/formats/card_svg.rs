//! The team card: one notebook page (100 × 150 mm) or slate, as SVG text. Black on white,
//! large turn figures, no colour needed to read it. Optional following pages carry each
//! diver's pairing charts. No I/O here: the caller writes the text.

use crate::i18n::{tr, tr_with};
use crate::plan::shown;
use crate::plan::{PairChart, TeamInput, TeamPlan};

/// Page size in millimetres.
pub const PAGE_W: f64 = 100.0;
/// Page height in millimetres.
pub const PAGE_H: f64 = 150.0;
/// Font families, with fallbacks, so a browser and a print tool pick the same kind of face.
pub const FONT: &str = "Roboto, 'Liberation Sans', Arial, Helvetica, sans-serif";
pub(super) const MARGIN: f64 = 5.0;

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

/// Escape text for XML.
pub fn xml_escape(s: &str) -> String {
    let mut out = String::with_capacity(s.len());
    for c in s.chars() {
        match c {
            '&' => out.push_str("&amp;"),
            '<' => out.push_str("&lt;"),
            '>' => out.push_str("&gt;"),
            '"' => out.push_str("&quot;"),
            '\'' => out.push_str("&apos;"),
            c if (c as u32) < 0x20 && c != '\n' && c != '\t' => {}
            c => out.push(c),
        }
    }
    out
}

/// Split text into lines of at most `width` characters at spaces.
pub fn wrap(text: &str, width: usize) -> Vec<String> {
    let mut lines = Vec::new();
    let mut line = String::new();
    for word in text.split_whitespace() {
        if !line.is_empty() && line.chars().count() + 1 + word.chars().count() > width {
            lines.push(std::mem::take(&mut line));
        }
        if !line.is_empty() {
            line.push(' ');
        }
        line.push_str(word);
    }
    if !line.is_empty() {
        lines.push(line);
    }
    lines
}

pub(super) struct Page {
    pub(super) body: String,
}

impl Page {
    pub(super) fn new() -> Self {
        Page {
            body: String::new(),
        }
    }
    /// Text at (x, y) mm, size in mm; `anchor` start/middle/end.
    pub(super) fn text(&mut self, x: f64, y: f64, size: f64, bold: bool, anchor: &str, s: &str) {
        self.body.push_str(&format!(
            "<text x=\"{x:.2}\" y=\"{y:.2}\" font-size=\"{size:.2}\"{}{} >{}</text>\n",
            if bold { " font-weight=\"bold\"" } else { "" },
            if anchor == "start" {
                String::new()
            } else {
                format!(" text-anchor=\"{anchor}\"")
            },
            xml_escape(s)
        ));
    }
    pub(super) fn line(&mut self, x1: f64, y1: f64, x2: f64, y2: f64, width: f64) {
        self.body.push_str(&format!(
            "<line x1=\"{x1:.2}\" y1=\"{y1:.2}\" x2=\"{x2:.2}\" y2=\"{y2:.2}\" stroke=\"#000\" stroke-width=\"{width:.2}\"/>\n"
        ));
    }
    pub(super) fn rect(&mut self, x: f64, y: f64, w: f64, h: f64, width: f64) {
        self.body.push_str(&format!(
            "<rect x=\"{x:.2}\" y=\"{y:.2}\" width=\"{w:.2}\" height=\"{h:.2}\" fill=\"none\" stroke=\"#000\" stroke-width=\"{width:.2}\"/>\n"
        ));
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

/// Pages stacked top to bottom, each 100 × 150 mm, separated by a cut line.
pub(super) fn svg_of(pages: &[Page], title: &str) -> String {
    let total_h = PAGE_H * pages.len().max(1) as f64;
    let mut s = format!(
        "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n\
         <svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{PAGE_W}mm\" height=\"{total_h}mm\" viewBox=\"0 0 {PAGE_W} {total_h}\" font-family=\"{FONT}\" fill=\"#000\">\n\
         <title>{}</title>\n<rect x=\"0\" y=\"0\" width=\"{PAGE_W}\" height=\"{total_h}\" fill=\"#fff\"/>\n",
        xml_escape(title)
    );
    for (k, page) in pages.iter().enumerate() {
        let dy = PAGE_H * k as f64;
        if k > 0 {
            s.push_str(&format!(
                "<line x1=\"0\" y1=\"{dy}\" x2=\"{PAGE_W}\" y2=\"{dy}\" stroke=\"#000\" stroke-width=\"0.2\" stroke-dasharray=\"2 2\"/>\n"
            ));
        }
        s.push_str(&format!("<g transform=\"translate(0 {dy})\">\n"));
        s.push_str(&page.body);
        s.push_str("</g>\n");
    }
    s.push_str("</svg>\n");
    s
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn wraps_at_spaces_and_escapes() {
        assert_eq!(wrap("aa bb cc dd", 5), vec!["aa bb", "cc dd"]);
        assert_eq!(xml_escape("A<B & 'C'"), "A&lt;B &amp; &apos;C&apos;");
    }
}
