//! Pages of SVG: the page size, the font, wrapping and escaping of text, one page's
//! drawing commands, and the pages stacked into one document. The card and the pairing
//! charts are drawn on these.

/// Page size in millimetres.
pub const PAGE_W: f64 = 100.0;
/// Page height in millimetres.
pub const PAGE_H: f64 = 150.0;
/// Font families, with fallbacks, so a browser and a print tool pick the same kind of face.
pub const FONT: &str = "Roboto, 'Liberation Sans', Arial, Helvetica, sans-serif";
pub(super) const MARGIN: f64 = 5.0;

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

/// Where a line may end: an ordinary space. A no-break space (U+00A0, U+2007, U+202F,
/// the French space before ":" or in "1 447") never ends a line and stays in the text.
fn breaks_at(c: char) -> bool {
    c.is_whitespace() && !matches!(c, '\u{a0}' | '\u{2007}' | '\u{202f}')
}

/// Units that stay on the line of the number before them.
const UNITS: [&str; 12] = [
    "L/min", "cu", "bar", "psi", "min", "°C", "°F", "L", "m", "ft", "%", "×",
];

/// Whether `word` is a unit that belongs to the number before it ("L", "bar)", "min.").
fn is_unit(word: &str) -> bool {
    let bare = word.trim_end_matches([',', ';', ':', ')', '.']);
    UNITS.contains(&bare) || UNITS.contains(&word)
}

/// The words of `text` between breakable spaces, a number and its unit joined into one
/// ("1447 L", "77.4 cu ft") so no line ends between them.
fn words(text: &str) -> Vec<String> {
    let mut out: Vec<String> = Vec::new();
    for w in text.split(breaks_at).filter(|w| !w.is_empty()) {
        let glue = out.last().is_some_and(|last| {
            let after_number = last.ends_with(|c: char| c.is_ascii_digit()) && is_unit(w);
            after_number || (last.ends_with(" cu") && w.starts_with("ft"))
        });
        match out.last_mut() {
            Some(last) if glue => {
                last.push(' ');
                last.push_str(w);
            }
            _ => out.push(w.to_string()),
        }
    }
    out
}

/// Split text into lines of at most `width` characters at ordinary spaces, never between
/// a number and its unit nor at a no-break space (a word longer than the line gets a
/// line of its own).
pub fn wrap(text: &str, width: usize) -> Vec<String> {
    let mut lines = Vec::new();
    let mut line = String::new();
    for word in words(text) {
        if !line.is_empty() && line.chars().count() + 1 + word.chars().count() > width {
            lines.push(std::mem::take(&mut line));
        }
        if !line.is_empty() {
            line.push(' ');
        }
        line.push_str(&word);
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

    #[test]
    fn never_breaks_at_a_no_break_space_and_keeps_it() {
        // French puts a no-break space before ":"; a narrow one groups thousands.
        let fr = "Lignes\u{a0}: départ lu par Ines, 1\u{202f}447 L";
        let lines = wrap(fr, 8);
        assert_eq!(lines[0], "Lignes\u{a0}:", "{lines:?}");
        assert!(lines.iter().any(|l| l == "1\u{202f}447 L"), "{lines:?}");
        assert_eq!(lines.concat().matches('\u{a0}').count(), 1, "kept");
    }

    #[test]
    fn never_ends_a_line_between_a_number_and_its_unit() {
        assert_eq!(wrap("total = 1447 L", 8), vec!["total =", "1447 L"]);
        assert_eq!(
            wrap("Ines 77.4 cu ft, 12 L) at 23 min.", 9),
            vec!["Ines", "77.4 cu ft,", "12 L) at", "23 min."]
        );
        // Text with no number keeps breaking as before; a lone letter is a word.
        assert_eq!(wrap("plan A L B", 6), vec!["plan A", "L B"]);
    }
}
