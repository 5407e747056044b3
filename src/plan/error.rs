//! Input errors that name the field and the allowed range.

use super::shown;
use crate::i18n::{tr, tr_with};

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
        return Err(InputError::new(field, tr("must be a number")));
    }
    if value < lo || value > hi {
        return Err(InputError::new(
            field,
            tr_with(
                "{0} {1} is out of range; allowed {2} to {3} {1}",
                &[&shown::num(value), &unit, &shown::num(lo), &shown::num(hi)],
            ),
        ));
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn huge_numbers_are_not_saturated() {
        let e = check_range("divers[0].start", 1e308, 1.0, 400.0, "bar").unwrap_err();
        assert!(e.message.starts_with("1e308 bar"), "{e}");
        assert!(!e.message.contains("9223372036854775807"), "{e}");
    }
}
