//! A cylinder set written on one line: `COUNTxSIZE@RATING`.
//!
//! - `2x12L@232bar`: two cylinders of 12 L water capacity, working pressure 232 bar;
//! - `1x80cuft@3000psi`: one cylinder rated 80 cu ft of free gas at 3000 psi.
//!
//! - `2x11.1L@207bar:indep`: two independent cylinders (sidemount) rather than twins on a
//!   manifold; `:independent` is read too, and only a pair can be independent.
//!
//! `COUNTx` may be left out (one cylinder). Letters are case-insensitive, spaces are
//! ignored, `×` may stand for `x` and a decimal comma for a decimal point. A size in L
//! goes with a rating in bar, a size in cu ft with a rating in psi. Ranges are the
//! planning core's (`validate_cylinders`), so a set that parses here also plans.
//! No I/O here.

use crate::plan::InputError;
use crate::plan::{CylinderSet, CylinderSpec, UnitSystem};
use crate::plan::{MAX_CYLINDERS, validate_cylinders};

/// How the form is shown in every error message.
pub const SPEC_FORM: &str = "COUNTxSIZE@RATING, e.g. 2x12L@232bar or 1x80cuft@3000psi";

/// Longest spec text looked at, in characters.
pub const MAX_SPEC_CHARS: usize = 64;

fn bad(text: &str, why: impl std::fmt::Display) -> InputError {
    InputError::new("SPEC", format!("'{text}': {why}; write {SPEC_FORM}"))
}

/// Split a number from its unit: `12.5L` → ("12.5", "l").
fn number_and_unit(part: &str) -> (&str, &str) {
    let end = part
        .find(|c: char| !(c.is_ascii_digit() || c == '.'))
        .unwrap_or(part.len());
    part.split_at(end)
}

fn number(text: &str, what: &str, digits: &str) -> Result<f64, InputError> {
    if digits.is_empty() {
        return Err(bad(text, format!("the {what} needs a number")));
    }
    match digits.parse::<f64>() {
        Ok(v) if v.is_finite() => Ok(v),
        _ => Err(bad(text, format!("the {what} '{digits}' is not a number"))),
    }
}

/// Parse a set written as `COUNTxSIZE@RATING`. Errors name `SPEC` (or the part at fault
/// under it, e.g. `SPEC.water_l`) and show the form.
pub fn parse_cylinder_spec(text: &str) -> Result<CylinderSet, InputError> {
    if text.chars().count() > MAX_SPEC_CHARS {
        return Err(InputError::new(
            "SPEC",
            format!(
                "{} characters is too long for a cylinder set (at most {MAX_SPEC_CHARS}); write {SPEC_FORM}",
                text.chars().count()
            ),
        ));
    }
    let shown = text.trim();
    let s: String = shown
        .chars()
        .filter(|c| !c.is_whitespace())
        .map(|c| match c {
            '×' => 'x',
            ',' => '.',
            c => c.to_ascii_lowercase(),
        })
        .collect();
    if s.is_empty() {
        return Err(bad(shown, "no cylinder set given"));
    }
    let (s, independent) = match s
        .strip_suffix(":independent")
        .or_else(|| s.strip_suffix(":indep"))
    {
        Some(rest) => (rest.to_string(), true),
        None => (s, false),
    };
    if s.contains(':') {
        return Err(bad(
            shown,
            "after ':' only 'indep' is read (a pair of independent cylinders)",
        ));
    }
    let Some((left, rating)) = s.split_once('@') else {
        return Err(bad(
            shown,
            "the rating is missing (an '@' and a pressure in bar or psi)",
        ));
    };
    if rating.contains('@') {
        return Err(bad(shown, "more than one '@'"));
    }
    let (count, size) = match left.split_once('x') {
        Some((c, size)) => {
            if c.is_empty() {
                return Err(bad(shown, "the count before 'x' is missing"));
            }
            let count = match c.parse::<u8>() {
                Ok(n) if (1..=MAX_CYLINDERS).contains(&n) => n,
                _ => {
                    return Err(InputError::new(
                        "SPEC.count",
                        format!(
                            "'{shown}': the count '{c}' must be a whole number from 1 to {MAX_CYLINDERS}; write {SPEC_FORM}"
                        ),
                    ));
                }
            };
            (count, size)
        }
        None => (1, left),
    };
    let (size_digits, size_unit) = number_and_unit(size);
    let size_value = number(shown, "size", size_digits)?;
    let (rating_digits, rating_unit) = number_and_unit(rating);
    let rating_value = number(shown, "rating", rating_digits)?;
    let metric_size = match size_unit {
        "l" => true,
        "cuft" | "ft3" | "cf" => false,
        "" => return Err(bad(shown, "the size needs a unit, L or cuft")),
        other => {
            return Err(bad(
                shown,
                format!("unknown size unit '{other}'; use L or cuft"),
            ));
        }
    };
    let metric_rating = match rating_unit {
        "bar" => true,
        "psi" => false,
        "" => return Err(bad(shown, "the rating needs a unit, bar or psi")),
        other => {
            return Err(bad(
                shown,
                format!("unknown rating unit '{other}'; use bar or psi"),
            ));
        }
    };
    let spec = match (metric_size, metric_rating) {
        (true, true) => CylinderSpec::Stamped {
            water_l: size_value,
            working_bar: rating_value,
        },
        (false, false) => CylinderSpec::Rated {
            rated_cuft: size_value,
            rated_psi: rating_value,
        },
        _ => {
            return Err(bad(
                shown,
                "a size in L goes with a rating in bar, a size in cuft with a rating in psi",
            ));
        }
    };
    if independent && count != 2 {
        return Err(InputError::new(
            "SPEC.count",
            format!("'{shown}': only a pair can be independent (2x…:indep); write {SPEC_FORM}"),
        ));
    }
    let set = CylinderSet {
        count,
        independent,
        spec,
    };
    validate_cylinders(UnitSystem::Metric, "SPEC", &set)?;
    Ok(set)
}

/// The canonical one-line form of a set, which `parse_cylinder_spec` reads back exactly
/// (shortest decimal that round-trips, no exponent; `:indep` for an independent pair).
pub fn format_cylinder_spec(set: &CylinderSet) -> String {
    let indep = if set.is_independent_pair() {
        ":indep"
    } else {
        ""
    };
    let one = match set.spec {
        CylinderSpec::Stamped {
            water_l,
            working_bar,
        } => format!("{}x{}L@{}bar", set.count, water_l, working_bar),
        CylinderSpec::Rated {
            rated_cuft,
            rated_psi,
        } => format!("{}x{}cuft@{}psi", set.count, rated_cuft, rated_psi),
    };
    one + indep
}

#[cfg(test)]
mod tests {
    use super::*;

    fn stamped(count: u8, water_l: f64, working_bar: f64) -> CylinderSet {
        CylinderSet {
            count,
            independent: false,
            spec: CylinderSpec::Stamped {
                water_l,
                working_bar,
            },
        }
    }

    #[test]
    fn reads_the_documented_forms() {
        assert_eq!(
            parse_cylinder_spec("2x12L@232bar").unwrap(),
            stamped(2, 12.0, 232.0)
        );
        assert_eq!(
            parse_cylinder_spec("1x80cuft@3000psi").unwrap(),
            CylinderSet {
                count: 1,
                independent: false,
                spec: CylinderSpec::Rated {
                    rated_cuft: 80.0,
                    rated_psi: 3000.0
                }
            }
        );
        assert_eq!(
            parse_cylinder_spec(" 2 × 11,1 l @ 207 BAR ").unwrap(),
            stamped(2, 11.1, 207.0)
        );
        assert_eq!(
            parse_cylinder_spec("7L@232bar").unwrap(),
            stamped(1, 7.0, 232.0)
        );
        // An independent pair (sidemount), in both spellings.
        let pair = CylinderSet::independent_pair(CylinderSpec::Stamped {
            water_l: 11.1,
            working_bar: 207.0,
        });
        assert_eq!(parse_cylinder_spec("2x11.1L@207bar:indep").unwrap(), pair);
        assert_eq!(
            parse_cylinder_spec("2 x 11.1 L @ 207 bar : Independent").unwrap(),
            pair
        );
    }

    #[test]
    fn errors_name_the_part_and_show_the_form() {
        let cases = [
            ("", "SPEC", "no cylinder set"),
            ("2x12L", "SPEC", "rating is missing"),
            ("2x12@232bar", "SPEC", "size needs a unit"),
            ("2x12L@232", "SPEC", "rating needs a unit"),
            ("2x12gal@232bar", "SPEC", "unknown size unit 'gal'"),
            ("2x12L@232atm", "SPEC", "unknown rating unit 'atm'"),
            ("2x12L@3000psi", "SPEC", "goes with"),
            ("x12L@232bar", "SPEC", "count before 'x'"),
            ("5x12L@232bar", "SPEC.count", "1 to 4"),
            ("2.5x12L@232bar", "SPEC.count", "whole number"),
            ("0x12L@232bar", "SPEC.count", "1 to 4"),
            ("2xL@232bar", "SPEC", "size needs a number"),
            ("2x1.2.3L@232bar", "SPEC", "not a number"),
            ("2x12L@@232bar", "SPEC", "more than one"),
            ("2x40L@232bar", "SPEC.water_l", "out of range"),
            ("2x12L@20bar", "SPEC.working_bar", "out of range"),
            ("1x80cuft@300psi", "SPEC.rated_psi", "out of range"),
            ("1x12L@232bar:indep", "SPEC.count", "only a pair"),
            ("2x12L@232bar:manifold", "SPEC", "only 'indep'"),
        ];
        for (text, field, why) in cases {
            let e = parse_cylinder_spec(text).unwrap_err();
            assert_eq!(e.field, field, "{text}: {e}");
            assert!(e.message.contains(why), "{text}: {e}");
            if field == "SPEC" || field == "SPEC.count" {
                assert!(e.message.contains("COUNTxSIZE@RATING"), "{text}: {e}");
            }
        }
        let long = "1".repeat(10_000);
        let e = parse_cylinder_spec(&long).unwrap_err();
        assert!(e.message.contains("too long"), "{e}");
    }

    #[test]
    fn canonical_form_reads_back() {
        for set in [
            stamped(2, 12.0, 232.0),
            stamped(1, 11.1, 207.0),
            stamped(4, 5.5, 300.0),
            CylinderSet::independent_pair(CylinderSpec::Rated {
                rated_cuft: 77.4,
                rated_psi: 3000.0,
            }),
        ] {
            let text = format_cylinder_spec(&set);
            assert_eq!(parse_cylinder_spec(&text).unwrap(), set, "{text}");
        }
        assert_eq!(
            format_cylinder_spec(&stamped(2, 12.0, 232.0)),
            "2x12L@232bar"
        );
    }
}
