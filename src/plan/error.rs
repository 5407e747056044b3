//! Input errors that name the field and the allowed range.

/// A rejected input: which field, and why (with the allowed range).
#[derive(Clone, Debug, PartialEq)]
pub struct InputError {
    /// Where the value sits, e.g. `divers[1].start` or `gauge_step`.
    pub field: String,
    /// What is wrong and what is allowed.
    pub message: String,
}

impl InputError {
    /// An error on `field` (e.g. `divers[1].start`), with a message saying what is wrong
    /// and what is allowed.
    pub fn new(field: impl Into<String>, message: impl Into<String>) -> Self {
        InputError {
            field: field.into(),
            message: message.into(),
        }
    }
}

impl std::fmt::Display for InputError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "{}: {}", self.field, self.message)
    }
}

impl std::error::Error for InputError {}

/// Check that `value` is a finite number within `lo..=hi`.
pub fn check_range(
    field: &str,
    value: f64,
    lo: f64,
    hi: f64,
    unit: &str,
) -> Result<(), InputError> {
    if !value.is_finite() {
        return Err(InputError::new(field, "must be a number"));
    }
    if value < lo || value > hi {
        return Err(InputError::new(
            field,
            format!(
                "{} {unit} is out of range; allowed {} to {} {unit}",
                fmt_num(value),
                fmt_num(lo),
                fmt_num(hi)
            ),
        ));
    }
    Ok(())
}

/// The first letter upper case, the rest as it is.
pub fn first_upper(s: &str) -> String {
    let mut c = s.chars();
    match c.next() {
        Some(f) => f.to_uppercase().collect::<String>() + c.as_str(),
        None => String::new(),
    }
}

/// A number without needless decimals. Magnitudes beyond what an integer holds
/// exactly print in scientific notation (`1e308`), never as a saturated integer.
pub fn fmt_num(x: f64) -> String {
    if !x.is_finite() || x.abs() >= 1e15 {
        format!("{x:e}")
    } else if (x - x.round()).abs() < 1e-9 {
        format!("{}", x.round() as i64)
    } else {
        let s = format!("{x:.2}");
        s.trim_end_matches('0').trim_end_matches('.').to_string()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn huge_numbers_are_not_saturated() {
        assert_eq!(fmt_num(1e308), "1e308");
        assert_eq!(fmt_num(-1e308), "-1e308");
        assert_eq!(fmt_num(f64::MAX), format!("{:e}", f64::MAX));
        assert_eq!(fmt_num(232.0), "232");
        assert_eq!(fmt_num(11.1), "11.1");
        assert_eq!(fmt_num(-0.0), "0");
        let e = check_range("divers[0].start", 1e308, 1.0, 400.0, "bar").unwrap_err();
        assert!(e.message.starts_with("1e308 bar"), "{e}");
        assert!(!e.message.contains("9223372036854775807"), "{e}");
    }
}
