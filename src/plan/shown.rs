//! Shown numbers: every number a diver reads is rounded and written here, so the
//! direction of rounding and the decimal separator are decided once for the app, the
//! command line and the card.
//!
//! Rounding goes toward safety: a start pressure and gas on hand round down, a turn
//! pressure rounds up, time to turn rounds down. Float noise within [`NOISE`] of a
//! value counts as that value (217.999 999 9 bar read as whole bar is 218).
//!
//! The decimal separator is a setting of the thread that writes the text (the app's
//! interface thread, or a command writing a card in a language): a point unless a
//! [`DecimalScope`] says otherwise. Files the program stores (team, locker) never go
//! through here: their numbers are JSON numbers.

pub use crate::i18n::decimal::{Decimal, DecimalScope, decimal, set_decimal};

/// Float noise tolerated around a value shown, in its unit.
pub const NOISE: f64 = 1e-6;

/// Rounded down to `places` decimals.
pub fn down(x: f64, places: i32) -> f64 {
    let k = 10f64.powi(places);
    ((x + NOISE) * k).floor() / k
}

/// Rounded up to `places` decimals.
pub fn up(x: f64, places: i32) -> f64 {
    let k = 10f64.powi(places);
    ((x - NOISE) * k).ceil() / k
}

/// Rounded down to a whole unit.
pub fn whole_down(x: f64) -> f64 {
    down(x, 0)
}

/// Rounded up to a whole unit.
pub fn whole_up(x: f64) -> f64 {
    up(x, 0)
}

/// A number without needless decimals (at most two), with this thread's separator.
/// Magnitudes beyond what an integer holds exactly print in scientific notation
/// (`1e308`), never as a saturated integer.
pub fn num(x: f64) -> String {
    let text = if !x.is_finite() || x.abs() >= 1e15 {
        format!("{x:e}")
    } else if (x - x.round()).abs() < 1e-9 {
        format!("{}", x.round() as i64)
    } else {
        let s = format!("{x:.2}");
        s.trim_end_matches('0').trim_end_matches('.').to_string()
    };
    match decimal() {
        Decimal::Point => text,
        Decimal::Comma => text.replace('.', ","),
    }
}

/// A number with exactly `places` decimals, with this thread's separator ("11.0").
pub fn fixed(x: f64, places: usize) -> String {
    let text = format!("{x:.places$}");
    match decimal() {
        Decimal::Point => text,
        Decimal::Comma => text.replace('.', ","),
    }
}

/// A start pressure (or any gas on hand) as read: whole units, rounded down.
pub fn start(value: f64) -> String {
    num(whole_down(value))
}

/// A turn pressure, already on the diver's graduation, as the gauge reads it (162.5 on
/// a 2.5 bar graduation); anything finer than a hundredth is rounded up.
pub fn turn(value: f64) -> String {
    num(up(value, 2))
}

/// A temperature to the nearest whole degree (water and fill temperatures as entered
/// and predicted; the prediction's own rounding toward safety is done where it is made).
pub fn degrees(value: f64) -> String {
    num(value.round())
}

/// Whole minutes, rounded down (time to turn).
pub fn minutes(m: f64) -> String {
    num(whole_down(m.max(0.0)))
}

/// A number typed by a person, with either separator ("157,5" or "157.5"); `None`
/// when it is not a plain decimal number.
pub fn parse(text: &str) -> Option<f64> {
    let t = text.trim();
    if t.is_empty() || t.matches([',', '.']).count() > 1 {
        return None;
    }
    let t = t.replace(',', ".");
    let ok = t
        .chars()
        .enumerate()
        .all(|(i, c)| c.is_ascii_digit() || c == '.' || (i == 0 && c == '-'));
    if !ok || !t.chars().any(|c| c.is_ascii_digit()) {
        return None;
    }
    t.parse().ok()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn rounding_goes_toward_safety() {
        assert_eq!(start(217.9), "217");
        assert_eq!(start(217.999_999_9), "218", "float noise");
        assert_eq!(turn(150.000_000_1), "150");
        assert_eq!(turn(149.999_999_9), "150");
        assert_eq!(turn(162.5), "162.5", "a 2.5 bar graduation");
        assert_eq!(turn(162.501), "162.51", "never below the value");
        assert_eq!(minutes(23.99), "23");
        assert_eq!(minutes(-1.0), "0");
        assert_eq!(down(1.259, 2), 1.25);
        assert_eq!(up(54.31, 1), 54.4);
    }

    #[test]
    fn huge_numbers_are_not_saturated() {
        assert_eq!(num(1e308), "1e308");
        assert_eq!(num(-1e308), "-1e308");
        assert_eq!(num(232.0), "232");
        assert_eq!(num(11.1), "11.1");
        assert_eq!(num(-0.0), "0");
    }

    #[test]
    fn the_separator_is_decided_here() {
        {
            let _c = DecimalScope::new(Decimal::Comma);
            assert_eq!(num(157.5), "157,5");
            assert_eq!(turn(162.5), "162,5");
            assert_eq!(fixed(11.0, 1), "11,0");
            assert_eq!(start(232.7), "232");
        }
        assert_eq!(num(157.5), "157.5", "the scope gives the point back");
    }

    #[test]
    fn typed_numbers_take_either_separator() {
        assert_eq!(parse("157,5"), Some(157.5));
        assert_eq!(parse("157.5"), Some(157.5));
        assert_eq!(parse("12"), Some(12.0));
        assert_eq!(parse("1,2,3"), None);
        assert_eq!(parse("1.2,3"), None);
        assert_eq!(parse(","), None);
        assert_eq!(parse("1e3"), None);
        assert_eq!(parse(""), None);
    }
}
