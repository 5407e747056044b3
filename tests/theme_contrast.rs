//! Text contrast of the theme's colour pairs: at least 7:1 (WCAG 2.1 contrast ratio,
//! success criterion 1.4.6 "Contrast (Enhanced)", using its relative-luminance formula).
//! Pairs are declared in ui/theme.slint with `// contrast-pair: FG on BG` comments.

fn colour(theme: &str, name: &str) -> [f64; 3] {
    let needle = format!("property <color> {name}:");
    let line = theme
        .lines()
        .find(|l| l.contains(&needle))
        .unwrap_or_else(|| panic!("colour {name} not in theme"));
    let hex = line.split('#').nth(1).unwrap().trim_end_matches(';').trim();
    let v = |i: usize| u8::from_str_radix(&hex[i..i + 2], 16).unwrap() as f64 / 255.0;
    [v(0), v(2), v(4)]
}

fn luminance(c: [f64; 3]) -> f64 {
    let lin = |x: f64| {
        if x <= 0.03928 {
            x / 12.92
        } else {
            ((x + 0.055) / 1.055).powf(2.4)
        }
    };
    0.2126 * lin(c[0]) + 0.7152 * lin(c[1]) + 0.0722 * lin(c[2])
}

fn contrast(a: [f64; 3], b: [f64; 3]) -> f64 {
    let (la, lb) = (luminance(a), luminance(b));
    (la.max(lb) + 0.05) / (la.min(lb) + 0.05)
}

#[test]
fn wcag_formula_matches_known_values() {
    // WCAG 2.1: black on white is 21:1; #777777 on white is about 4.48:1.
    assert!((contrast([0.0; 3], [1.0; 3]) - 21.0).abs() < 1e-9);
    let grey = 0x77 as f64 / 255.0;
    assert!((contrast([grey; 3], [1.0; 3]) - 4.48).abs() < 0.01);
}

#[test]
fn every_declared_pair_reaches_seven_to_one() {
    let theme = include_str!("../ui/theme.slint");
    let mut pairs = 0;
    for line in theme.lines() {
        if let Some(rest) = line.trim().strip_prefix("// contrast-pair:") {
            let parts: Vec<&str> = rest.split(" on ").map(str::trim).collect();
            let (fg, bg) = (colour(theme, parts[0]), colour(theme, parts[1]));
            let c = contrast(fg, bg);
            assert!(c >= 7.0, "{} on {}: {c:.2}:1", parts[0], parts[1]);
            pairs += 1;
        }
    }
    assert!(pairs >= 8, "only {pairs} pairs declared");
}
