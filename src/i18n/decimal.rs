//! The decimal separator a thread writes numbers with: a point in English, a comma in
//! the other languages. The language sets it; a scope may set it for a while.

use std::cell::Cell;

/// The decimal separator of shown numbers.
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq)]
pub enum Decimal {
    /// 157.5 (English).
    #[default]
    Point,
    /// 157,5 (Spanish, French, German, Italian, Portuguese).
    Comma,
}

impl Decimal {
    /// The separator as a character.
    pub fn mark(self) -> char {
        match self {
            Decimal::Point => '.',
            Decimal::Comma => ',',
        }
    }
}

thread_local! {
    static DECIMAL: Cell<Decimal> = const { Cell::new(Decimal::Point) };
}

/// The separator this thread writes now.
pub fn decimal() -> Decimal {
    DECIMAL.with(|d| d.get())
}

/// Sets the separator for this thread until changed again (the app sets it from the
/// chosen language).
pub fn set_decimal(d: Decimal) {
    DECIMAL.with(|c| c.set(d));
}

/// A separator for as long as the scope lives; the one before comes back after.
#[must_use = "the separator holds only while the scope lives"]
pub struct DecimalScope(Decimal);

impl DecimalScope {
    /// Writes with `d` until the scope is dropped.
    pub fn new(d: Decimal) -> DecimalScope {
        let before = decimal();
        set_decimal(d);
        DecimalScope(before)
    }
}

impl Drop for DecimalScope {
    fn drop(&mut self) {
        set_decimal(self.0);
    }
}
