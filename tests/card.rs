//! The printable team card: valid SVG (parsed as XML), every diver's name and shown turn
//! in their own unit on it, and a golden rendering (rasterised with resvg using the
//! app's own Roboto fonts) so layout regressions show.
//!
//! To refresh the golden image after an intended layout change:
//! `TURNSHEET_UPDATE_GOLDEN=1 cargo test --test card`, then look at tests/data/card-demo.png
//! (docs/card.png, the README's picture, is written from the same rendering).

use std::path::PathBuf;

use turnsheet::formats::card_svg::{CardHeading, card_svg};
use turnsheet::formats::team_file::TeamFile;
use turnsheet::plan::plan_team;
use turnsheet::plan::shown;
use turnsheet::plan::team_charts;

fn demo() -> turnsheet::plan::TeamInput {
    TeamFile::parse(include_str!("../examples/hollowmere-team.json"))
        .unwrap()
        .to_input()
        .unwrap()
}

fn heading() -> CardHeading {
    CardHeading {
        dive: Some("Hollowmere spring, upstream".into()),
        date: Some("2026-12-05".into()),
        read_at: Vec::new(),
        labels: Default::default(),
    }
}

fn tree(svg: &str) -> resvg::usvg::Tree {
    let mut db = resvg::usvg::fontdb::Database::new();
    for f in [
        &include_bytes!("../ui/fonts/Roboto-Regular.ttf")[..],
        &include_bytes!("../ui/fonts/Roboto-Bold.ttf")[..],
    ] {
        db.load_font_data(f.to_vec());
    }
    let opt = resvg::usvg::Options {
        fontdb: std::sync::Arc::new(db),
        ..Default::default()
    };
    resvg::usvg::Tree::from_str(svg, &opt).expect("card parses as SVG")
}

fn render(svg: &str, scale: f32) -> resvg::tiny_skia::Pixmap {
    let tree = tree(svg);
    let size = tree.size();
    let (w, h) = (
        (size.width() * scale).ceil() as u32,
        (size.height() * scale).ceil() as u32,
    );
    let mut pixmap = resvg::tiny_skia::Pixmap::new(w, h).unwrap();
    resvg::render(
        &tree,
        resvg::tiny_skia::Transform::from_scale(scale, scale),
        &mut pixmap.as_mut(),
    );
    pixmap
}

#[test]
fn card_is_xml_with_every_name_and_turn() {
    let team = demo();
    let plan = plan_team(&team).unwrap();
    let svg = card_svg(&heading(), &team, &plan, &[]);
    let doc = roxmltree::Document::parse(&svg).expect("well-formed XML");
    let text: String = doc
        .descendants()
        .filter(|n| n.is_text())
        .filter_map(|n| n.text())
        .collect::<Vec<_>>()
        .join("\n");
    for d in &plan.divers {
        assert!(text.contains(&d.name), "{} missing", d.name);
        let turn = format!("{} {}", shown::num(d.turn_shown_value), d.gauge.label());
        assert!(text.contains(&turn), "{turn} missing");
        if let Some(st) = &d.stage {
            assert!(text.contains(&format!(
                "drop stage at {} {}",
                shown::num(st.drop_shown_value),
                d.gauge.label()
            )));
        }
    }
    // The diver whose gas sets the allowance the turns use is named.
    let team = demo();
    for a in turnsheet::plan::allowance_sources(&team, &plan) {
        let c = &plan.divers[a.diver];
        assert!(text.contains(&format!("{} control", c.name)), "{}", c.name);
    }
    assert!(text.contains("Check by hand"));
    assert!(text.contains("Hollowmere spring, upstream"));
    // 100 × 150 mm page.
    let root = doc.root_element();
    assert_eq!(root.attribute("width"), Some("100mm"));
    assert_eq!(root.attribute("height"), Some("150mm"));
}

#[test]
fn charts_add_one_page_per_pairing() {
    let team = demo();
    let plan = plan_team(&team).unwrap();
    let charts = team_charts(&team, 2, 7).unwrap();
    let svg = card_svg(&heading(), &team, &plan, &charts);
    let doc = roxmltree::Document::parse(&svg).unwrap();
    let pages = 1 + charts.len();
    assert_eq!(
        doc.root_element().attribute("height"),
        Some(format!("{}mm", 150 * pages).as_str())
    );
    // Every chart cell's turn is printed.
    let texts: Vec<&str> = doc.descendants().filter_map(|n| n.text()).collect();
    for c in &charts {
        for row in &c.turns {
            for cell in row.iter().flatten() {
                assert!(texts.contains(&shown::num(*cell).as_str()));
            }
        }
    }
    render(&svg, 2.0);
}

#[test]
fn demo_card_matches_its_golden_rendering() {
    let team = demo();
    let plan = plan_team(&team).unwrap();
    let svg = card_svg(&heading(), &team, &plan, &[]);
    // 100 × 150 mm at 96 px per inch (the CSS definition: CSS Values and Units Module
    // Level 3, 1in = 96px; 1in = 25.4 mm) × 1.5: 377.95 × 1.5 = 567 by 851 px.
    let pixmap = render(&svg, 1.5);
    let golden = PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("tests/data/card-demo.png");
    if std::env::var_os("TURNSHEET_UPDATE_GOLDEN").is_some() {
        std::fs::create_dir_all(golden.parent().unwrap()).unwrap();
        pixmap.save_png(&golden).unwrap();
        // The README's picture of the card is the same rendering.
        let docs = PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("docs/card.png");
        pixmap.save_png(docs).unwrap();
    }
    let decoder = png::Decoder::new(std::io::BufReader::new(
        std::fs::File::open(&golden).expect("golden image exists; see the file's header"),
    ));
    let mut reader = decoder.read_info().unwrap();
    let mut buf = vec![0; reader.output_buffer_size()];
    let info = reader.next_frame(&mut buf).unwrap();
    assert_eq!((info.width, info.height), (pixmap.width(), pixmap.height()));
    let (w, h) = (info.width as usize, info.height as usize);
    assert_eq!(info.color_type, png::ColorType::Rgba);
    let ours = pixmap.data();
    let mut differ = 0usize;
    let mut ink = 0usize;
    for px in 0..w * h {
        let a = &ours[px * 4..px * 4 + 4];
        let b = &buf[px * 4..px * 4 + 4];
        if a.iter().zip(b).any(|(x, y)| x.abs_diff(*y) > 64) {
            differ += 1;
        }
        if a[0] < 128 {
            ink += 1;
        }
    }
    // Black on white with real content, and at most 0.5 % of pixels changed.
    assert!(ink > w * h / 50, "too little ink: {ink}");
    assert!(differ * 200 <= w * h, "{differ} of {} pixels differ", w * h);
}

/// The text of every element of a card, one per line.
fn texts_of(svg: &str) -> Vec<String> {
    let doc = roxmltree::Document::parse(svg).expect("well-formed XML");
    doc.descendants()
        .filter(|n| n.is_text())
        .filter_map(|n| n.text())
        .map(str::to_string)
        .collect()
}

#[test]
fn a_card_in_german_writes_decimal_commas() {
    // The demo team on a 2.5 bar graduation, so turns can fall on half bars.
    let mut team: serde_json::Value =
        serde_json::from_str(include_str!("../examples/hollowmere-team.json")).unwrap();
    team["gauge_step"] = serde_json::json!(2.5);
    let dir = tempfile::tempdir().unwrap();
    let file = dir.path().join("team.json");
    std::fs::write(&file, team.to_string()).unwrap();
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_turnsheet"))
        .arg("card")
        .arg(&file)
        .args(["--lang", "de", "--date", "2026-12-05"])
        .output()
        .unwrap();
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let svg = String::from_utf8(out.stdout).unwrap();
    let text = texts_of(&svg).join("\n");
    // Every turn as a German gauge reads it: the plan's figure with a comma.
    let input = TeamFile::parse(&team.to_string())
        .unwrap()
        .to_input()
        .unwrap();
    let plan = plan_team(&input).unwrap();
    let mut halves = 0;
    for d in &plan.divers {
        let point = shown::turn(d.turn_shown_value);
        let comma = point.replace('.', ",");
        assert!(
            text.contains(&format!("{comma} {}", d.gauge.label())),
            "{comma} missing"
        );
        if point.contains('.') {
            halves += 1;
            assert!(!text.contains(&format!("{point} {}", d.gauge.label())));
        }
    }
    // At least one turn on the 2.5 bar graduation is not a whole bar (checked above with
    // its comma); the set sizes keep their decimals too (Bram's rating, 77.4 cu ft).
    assert!(
        halves > 0,
        "no half-bar turn: the check above tested no comma"
    );
    assert!(text.contains("77,4 cu ft"), "Bram's set, with a comma");
    assert!(!text.contains("77.4 cu ft"), "no decimal point left");
}

#[test]
fn an_unknown_card_language_is_refused_with_the_codes() {
    let demo = PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("examples/hollowmere-team.json");
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_turnsheet"))
        .arg("card")
        .arg(&demo)
        .args(["--lang", "klingon"])
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(2), "bad input");
    assert!(out.stdout.is_empty(), "no card");
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains("--lang"), "{err}");
    for code in ["en", "es", "fr", "de", "it", "pt_BR"] {
        assert!(err.contains(code), "{code} not listed: {err}");
    }
    assert!(!err.contains("panicked"), "{err}");
}

/// Every text of the card laid out by resvg with the app's fonts: its words and the box
/// its glyphs fill, as (left, top, right, bottom) in mm.
fn laid_out_texts(svg: &str) -> Vec<(String, [f32; 4])> {
    fn walk(g: &resvg::usvg::Group, mm: f32, out: &mut Vec<(String, [f32; 4])>) {
        for node in g.children() {
            match node {
                resvg::usvg::Node::Group(g) => walk(g, mm, out),
                resvg::usvg::Node::Text(t) => {
                    let words = t.chunks().iter().map(|c| c.text()).collect::<String>();
                    let r = t.flattened().abs_bounding_box();
                    out.push((
                        words,
                        [r.left() / mm, r.top() / mm, r.right() / mm, r.bottom() / mm],
                    ));
                }
                _ => {}
            }
        }
    }
    let tree = tree(svg);
    // The canvas is in CSS px; the page is 100 mm wide.
    let mm = tree.size().width() / 100.0;
    let mut out = Vec::new();
    walk(tree.root(), mm, &mut out);
    out
}

#[test]
fn long_set_names_stay_on_the_page_and_off_the_turns() {
    use turnsheet::plan::SetLabels;
    // The longest names a set can have (40 characters), with wide letters.
    let team = demo();
    let plan = plan_team(&team).unwrap();
    let long = "MMMM WWWW Sidemount aluminium 77.4 cu ft";
    assert_eq!(long.chars().count(), 40);
    let mut heading = heading();
    heading.labels = SetLabels {
        sets: vec![String::new(), long.into(), long.into()],
        stages: vec![long.into(), String::new(), long.into()],
    };
    for heading in [heading, self::heading()] {
        let svg = card_svg(&heading, &team, &plan, &[]);
        let texts = laid_out_texts(&svg);
        assert!(texts.len() > 10, "{texts:?}");
        // Inside the 5 mm margins of the 100 × 150 mm page.
        for (words, [left, top, right, bottom]) in &texts {
            assert!(
                *left >= 4.5 && *right <= 95.5 && *top >= 0.0 && *bottom <= 145.5,
                "{words} runs off the page: {left} {top} {right} {bottom}"
            );
        }
        // No two texts' glyphs touch.
        for (k, (a, ra)) in texts.iter().enumerate() {
            for (b, rb) in &texts[k + 1..] {
                let apart = ra[2] <= rb[0] || rb[2] <= ra[0] || ra[3] <= rb[1] || rb[3] <= ra[1];
                assert!(apart, "'{a}' {ra:?} overlaps '{b}' {rb:?}");
            }
        }
    }
}

/// Units that stay on the line of their number.
const UNITS: [&str; 10] = [
    "L/min", "cu", "bar", "psi", "min", "°C", "°F", "L", "ft", "m",
];

#[test]
fn no_card_line_parts_a_number_from_its_unit_in_any_language() {
    use turnsheet::i18n::{Language, LanguageScope};
    let team = demo();
    let plan = plan_team(&team).unwrap();
    let charts = team_charts(&team, 2, 7).unwrap();
    let names = plan.names();
    for l in Language::ALL {
        let _scope = LanguageScope::new(l);
        let svg = card_svg(&heading(), &team, &plan, &charts);
        let lines = texts_of(&svg);
        for pair in lines.windows(2) {
            let ends_in_number = pair[0].trim_end().ends_with(|c: char| c.is_ascii_digit());
            let first = pair[1].split(' ').next().unwrap_or("");
            let unit = UNITS.contains(&first.trim_end_matches([',', '.', ')', ';']));
            assert!(
                !(ends_in_number && unit),
                "{l:?}: a line ends {:?} and the next begins {:?}",
                pair[0],
                pair[1]
            );
        }
        // A no-break space the language writes (French, before ":") is kept.
        if l == Language::French {
            assert!(
                lines.iter().any(|t| t.contains("\u{a0}:")),
                "French lost its no-break space before ':'"
            );
        }
        // No possessive of a name, in any language (a name may be "Me" or "Chris").
        for n in &names {
            for t in &lines {
                assert!(!t.contains(&format!("{n}'s")), "{l:?}: {t}");
                assert!(!t.contains(&format!("{n}’s")), "{l:?}: {t}");
            }
        }
    }
}
