//! The out-of-gas check: for every pair of divers, can the donor's remaining gas
//! bring both out if the other loses everything at the turn?

use super::units::Volume;
use crate::i18n::{tr, tr_with};

/// Result of the pairwise check.
#[derive(Clone, Debug, PartialEq)]
pub struct StressCheck {
    /// Smallest margin over all ordered pairs; infinite when nobody spends gas.
    /// A margin of N means the donor's gas covers both exits at up to N× normal breathing.
    pub margin: f64,
    /// (failing diver, donor) of the worst pair.
    pub worst_pair: Option<(usize, usize)>,
}

/// margin(i fails, j donates) = (content_j − used_j) / (used_i + used_j), minimised over i ≠ j.
pub fn stress_check(contents: &[Volume], used: &[Volume]) -> StressCheck {
    let mut margin = f64::INFINITY;
    let mut worst_pair = None;
    for i in 0..contents.len() {
        for j in 0..contents.len() {
            if i == j {
                continue;
            }
            let need = used[i].litres() + used[j].litres();
            if need <= 0.0 {
                continue;
            }
            let m = (contents[j].litres() - used[j].litres()) / need;
            if m < margin {
                margin = m;
                worst_pair = Some((i, j));
            }
        }
    }
    StressCheck { margin, worst_pair }
}

/// The margin rounded DOWN to hundredths, for display.
pub fn margin_for_display(margin: f64) -> f64 {
    super::shown::down(margin, 2)
}

/// One sentence saying what the margin means for this team.
pub fn describe_margin(check: &StressCheck, names: &[String]) -> String {
    match check.worst_pair {
        None => tr("No gas is spent before the turn, so there is nothing to share."),
        Some((fail, donor)) => {
            let m = margin_for_display(check.margin);
            let shown_m = super::shown::fixed(m, 2);
            let verdict = if m < 1.0 {
                tr_with(
                    "Not enough to bring a teammate out even at normal breathing (only {0} ×): do not dive this plan.",
                    &[&shown_m],
                )
            } else if m < 1.5 {
                tr_with(
                    "Enough to bring a teammate out at {0} × normal breathing; at 1.5 × it is not: consider a stricter rule.",
                    &[&shown_m],
                )
            } else {
                tr_with(
                    "Enough to bring a teammate out at up to {0} × normal breathing (1.5 to 2 × is common under stress).",
                    &[&shown_m],
                )
            };
            let worst = tr_with(
                "Worst case: {0} out of gas at the turn, sharing with {1}.",
                &[&names[fail], &names[donor]],
            );
            format!("{verdict} {worst}")
        }
    }
}

/// The sentence for the margin at the moment the first diver turns, if it is known.
pub fn describe_margin_at_first_turn(
    at_turn: Option<&StressCheck>,
    first: Option<usize>,
    minutes: Option<f64>,
    names: &[String],
) -> String {
    match (at_turn, first, minutes) {
        (Some(check), Some(i), Some(m)) if check.margin.is_finite() => tr_with(
            "With the breathing rates entered, the team turns when {0} does, after about {1} min; the others have used less by then, so it is enough at up to {2} × normal breathing.",
            &[
                &names[i],
                &super::shown::minutes(m),
                &super::shown::fixed(margin_for_display(check.margin), 2),
            ],
        ),
        _ => String::new(),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn identical_divers_on_thirds_have_margin_one() {
        // Worked by hand (common practice): used = content/3 for both gives (C − C/3)/(2C/3) = 1.
        let c = vec![Volume::from_litres(3000.0); 2];
        let u = vec![Volume::from_litres(1000.0); 2];
        let s = stress_check(&c, &u);
        assert!((s.margin - 1.0).abs() < 1e-12);
        assert_eq!(margin_for_display(0.99999999999), 1.0);
        assert_eq!(margin_for_display(1.239), 1.23);
    }

    #[test]
    fn the_verdict_comes_first() {
        // Thirds on identical divers: exactly 1 × (common practice), enough at normal
        // breathing and not at 1.5 ×.
        let c = vec![Volume::from_litres(3000.0); 2];
        let u = vec![Volume::from_litres(1000.0); 2];
        let names = vec!["A".to_string(), "B".to_string()];
        let text = describe_margin(&stress_check(&c, &u), &names);
        assert!(
            text.starts_with(
                "Enough to bring a teammate out at 1.00 × normal breathing; at 1.5 × it is not"
            ),
            "{text}"
        );
        // Sixths: (1 − 1/6) / (2/6) = 2.5 ×.
        let u = vec![Volume::from_litres(500.0); 2];
        let text = describe_margin(&stress_check(&c, &u), &names);
        assert!(
            text.starts_with("Enough to bring a teammate out at up to 2.50 ×"),
            "{text}"
        );
        // Halves: (1 − 1/2) / 1 = 0.5 ×.
        let u = vec![Volume::from_litres(1500.0); 2];
        let text = describe_margin(&stress_check(&c, &u), &names);
        assert!(text.starts_with("Not enough"), "{text}");
    }

    #[test]
    fn nothing_used_is_infinite() {
        let c = vec![Volume::from_litres(3000.0); 3];
        let u = vec![Volume::ZERO; 3];
        assert!(stress_check(&c, &u).margin.is_infinite());
    }
}
