//! Rounding to gauge steps. Pressures shown to a diver sit on the gauge step: turns
//! are rounded up, starts down, and a nudge moves to the next mark on the gauge.

/// Round `value` up to a multiple of `step`, tolerating float noise of 1e-9 steps.
pub fn round_up_to_step(value: f64, step: f64) -> f64 {
    let k = (value / step - 1e-9).ceil();
    k * step
}

/// Round `value` down to a multiple of `step`, tolerating float noise of 1e-9 steps.
pub fn round_down_to_step(value: f64, step: f64) -> f64 {
    let k = (value / step + 1e-9).floor();
    k * step
}

/// The next multiple of `step` from `value` in `direction` (up when positive, down when
/// negative). A value on a multiple moves by one whole step; a value between two
/// multiples moves to the nearer one in that direction. A zero direction returns
/// `value` unchanged. The result may be zero or negative: callers check the range.
pub fn next_step(value: f64, step: f64, direction: i32) -> f64 {
    match direction.signum() {
        1 => round_down_to_step(value, step) + step,
        -1 => round_up_to_step(value, step) - step,
        _ => value,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn rounding_toward_safety() {
        assert_eq!(round_up_to_step(143.3, 10.0), 150.0);
        assert_eq!(round_up_to_step(150.0, 10.0), 150.0);
        assert_eq!(round_up_to_step(150.000_000_000_01, 10.0), 150.0);
        assert_eq!(round_up_to_step(1501.0, 100.0), 1600.0);
        assert_eq!(round_down_to_step(79.9, 5.0), 75.0);
        assert_eq!(round_down_to_step(80.0, 5.0), 80.0);
    }

    #[test]
    fn next_step_lands_on_the_gauge_marks() {
        assert_eq!(next_step(210.0, 10.0, 1), 220.0);
        assert_eq!(next_step(210.0, 10.0, -1), 200.0);
        assert_eq!(next_step(217.0, 10.0, 1), 220.0);
        assert_eq!(next_step(217.0, 10.0, -1), 210.0);
        assert_eq!(next_step(3150.0, 100.0, 1), 3200.0);
        assert_eq!(next_step(3150.0, 100.0, -1), 3100.0);
        assert_eq!(next_step(5.0, 5.0, -1), 0.0);
        assert_eq!(next_step(217.0, 10.0, 0), 217.0);
        // Float noise on a mark counts as the mark.
        assert_eq!(next_step(219.999_999_999_9, 10.0, 1), 230.0);
        assert_eq!(next_step(220.000_000_000_1, 10.0, -1), 210.0);
    }
}
