//! Gas rules: the fraction of each diver's gas the team may spend before turning.

use serde::{Deserialize, Serialize};

use crate::i18n::tr;

/// A gas rule: going in, each diver may spend the rule's fraction of the smallest
/// diver's gas, so every diver spends the same volume.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize, Deserialize, Default)]
#[serde(rename_all = "lowercase")]
pub enum Rule {
    /// One half: an open-water rule, not for overhead environments.
    Halves,
    /// One third: the usual minimum in overhead environments.
    #[default]
    Thirds,
    /// One quarter.
    Quarters,
    /// One fifth.
    Fifths,
    /// One sixth.
    Sixths,
}

impl Rule {
    /// Every rule, from the most gas spent going in (halves) to the least (sixths).
    pub const ALL: [Rule; 5] = [
        Rule::Halves,
        Rule::Thirds,
        Rule::Quarters,
        Rule::Fifths,
        Rule::Sixths,
    ];

    /// The fraction of gas the team may spend going in.
    pub fn fraction(self) -> f64 {
        1.0 / f64::from(self.denominator())
    }

    /// The n of the fraction 1/n: 2 for halves up to 6 for sixths.
    pub fn denominator(self) -> u8 {
        match self {
            Rule::Halves => 2,
            Rule::Thirds => 3,
            Rule::Quarters => 4,
            Rule::Fifths => 5,
            Rule::Sixths => 6,
        }
    }

    /// The lowercase name, as written in team files: "halves" to "sixths".
    pub fn name(self) -> &'static str {
        match self {
            Rule::Halves => "halves",
            Rule::Thirds => "thirds",
            Rule::Quarters => "quarters",
            Rule::Fifths => "fifths",
            Rule::Sixths => "sixths",
        }
    }

    /// The lowercase name as people read it, in this thread's language ("thirds" in
    /// English); files keep [`Rule::name`].
    pub fn shown_name(self) -> String {
        match self {
            Rule::Halves => tr("halves"),
            Rule::Thirds => tr("thirds"),
            Rule::Quarters => tr("quarters"),
            Rule::Fifths => tr("fifths"),
            Rule::Sixths => tr("sixths"),
        }
    }

    /// The name as a title or a choice, in this thread's language ("Thirds").
    pub fn title(self) -> String {
        match self {
            Rule::Halves => tr("Halves"),
            Rule::Thirds => tr("Thirds"),
            Rule::Quarters => tr("Quarters"),
            Rule::Fifths => tr("Fifths"),
            Rule::Sixths => tr("Sixths"),
        }
    }

    /// The rule's full name, in this thread's language ("Rule of thirds").
    pub fn rule_of(self) -> String {
        match self {
            Rule::Halves => tr("Rule of halves"),
            Rule::Thirds => tr("Rule of thirds"),
            Rule::Quarters => tr("Rule of quarters"),
            Rule::Fifths => tr("Rule of fifths"),
            Rule::Sixths => tr("Rule of sixths"),
        }
    }

    /// The rule of that name, in any case, ignoring surrounding spaces; `None` if there
    /// is none.
    pub fn parse(s: &str) -> Option<Rule> {
        Rule::ALL
            .into_iter()
            .find(|r| r.name().eq_ignore_ascii_case(s.trim()))
    }

    /// Whether the rule is meant for overhead environments at all.
    pub fn fit_for_overhead(self) -> bool {
        self != Rule::Halves
    }

    /// The guaranteed out-of-gas stress margin of the rule: (1 − f) / (2f).
    pub fn guaranteed_margin(self) -> f64 {
        let f = self.fraction();
        (1.0 - f) / (2.0 * f)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn margins_follow_the_fraction() {
        // Worked by hand from the margin formula (common practice): thirds 1.0, quarters 1.5, sixths 2.5.
        assert!((Rule::Thirds.guaranteed_margin() - 1.0).abs() < 1e-12);
        assert!((Rule::Quarters.guaranteed_margin() - 1.5).abs() < 1e-12);
        assert!((Rule::Sixths.guaranteed_margin() - 2.5).abs() < 1e-12);
    }

    #[test]
    fn parse_names() {
        assert_eq!(Rule::parse("Thirds"), Some(Rule::Thirds));
        assert_eq!(Rule::parse("sevenths"), None);
        assert!(!Rule::Halves.fit_for_overhead());
        // In English the shown words are the file's name, its title and "Rule of …".
        for r in Rule::ALL {
            assert_eq!(r.shown_name(), r.name());
            assert_eq!(r.title(), crate::plan::text::first_upper(r.name()));
            assert_eq!(r.rule_of(), format!("Rule of {}", r.name()));
        }
    }
}
