//! Pairing chart pages for the card: rows my start, columns a teammate's, cells my turn.
//! No I/O here: the caller writes the text.

use super::svg_page::{MARGIN, PAGE_H, PAGE_W, Page, svg_of, wrap};
use crate::i18n::{tr, tr_with};
use crate::plan::{PairChart, TeamInput, shown};

/// One pairing chart page: rows my start, columns the buddy's, cells my turn, each on its
/// own gauge; the planned cell boxed.
pub(super) fn chart_page(team: &TeamInput, chart: &PairChart) -> Page {
    let mut p = Page::new();
    let me = &team.divers[chart.me];
    let buddy = &team.divers[chart.buddy];
    let (mu, bu) = (chart.my_gauge.label(), chart.buddy_gauge.label());
    let mut y = MARGIN + 5.0;
    p.text(
        MARGIN,
        y,
        4.2,
        true,
        "start",
        &tr_with("{0}: turn against {1}", &[&me.name, &buddy.name]),
    );
    y += 4.5;
    for line in wrap(
        &tr_with(
            "Rows: start read by {0} ({1}). Columns: start read by {2} ({3}). Cells: turn for {0} ({1}). Between lines, read the next higher own start and the next lower teammate start; with more teammates keep the highest turn.",
            &[&me.name, &mu, &buddy.name, &bu],
        ),
        64,
    ) {
        p.text(MARGIN, y, 2.5, false, "start", &line);
        y += 3.1;
    }
    y += 1.5;
    let cols = chart.buddy_starts.len().max(1);
    let rows = chart.my_starts.len().max(1);
    let label_w = 11.0;
    let cell_w = ((PAGE_W - 2.0 * MARGIN - label_w) / cols as f64).min(9.0);
    let cell_h = ((PAGE_H - y - MARGIN - 6.0) / (rows as f64 + 1.0)).min(6.5);
    let size = (cell_w * 0.36).min(cell_h * 0.62).min(3.2);
    let x0 = MARGIN + label_w;
    p.text(
        MARGIN,
        y + cell_h * 0.7,
        size * 0.9,
        false,
        "start",
        &format!("{mu}\\{bu}"),
    );
    for (c, b) in chart.buddy_starts.iter().enumerate() {
        p.text(
            x0 + cell_w * (c as f64 + 0.5),
            y + cell_h * 0.7,
            size,
            true,
            "middle",
            &shown::num(*b),
        );
    }
    p.line(
        MARGIN,
        y + cell_h,
        x0 + cell_w * cols as f64,
        y + cell_h,
        0.3,
    );
    let planned_me = chart.my_gauge.value(me.start);
    let planned_buddy = chart.buddy_gauge.value(buddy.start);
    for (r, m) in chart.my_starts.iter().enumerate() {
        let ry = y + cell_h * (r as f64 + 1.0);
        p.text(
            MARGIN,
            ry + cell_h * 0.7,
            size,
            true,
            "start",
            &shown::num(*m),
        );
        for (c, b) in chart.buddy_starts.iter().enumerate() {
            let text = chart.turns[r][c]
                .map(shown::turn)
                .unwrap_or_else(|| "-".into());
            let cx = x0 + cell_w * c as f64;
            p.text(
                cx + cell_w * 0.5,
                ry + cell_h * 0.7,
                size,
                false,
                "middle",
                &text,
            );
            if (m - planned_me).abs() < 1e-6 && (b - planned_buddy).abs() < 1e-6 {
                p.rect(cx + 0.3, ry + 0.3, cell_w - 0.6, cell_h - 0.6, 0.4);
            }
        }
    }
    p.line(x0, y, x0, y + cell_h * (rows as f64 + 1.0), 0.3);
    p.text(
        MARGIN,
        PAGE_H - MARGIN,
        2.3,
        false,
        "start",
        &tr("Boxed: the planned starts. '-': a start the cylinders cannot take. Check by hand."),
    );
    p
}

/// Pairing charts only, one page each (no card page).
pub fn charts_svg(team: &TeamInput, charts: &[PairChart]) -> String {
    let pages: Vec<Page> = charts.iter().map(|c| chart_page(team, c)).collect();
    svg_of(&pages, &tr("Pairing charts"))
}
