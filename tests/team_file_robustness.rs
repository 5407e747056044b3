//! Bad input never panics: random edits of the demo team file go through parsing,
//! conversion and planning and end in either a plan or an error that names a field.

use proptest::prelude::*;
use turnsheet::formats::team_file::TeamFile;
use turnsheet::plan::plan_team;

const DEMO: &str = include_str!("../examples/hollowmere-team.json");

/// The numbers of the demo file, replaced one at a time by a hostile value.
fn hostile_number() -> impl Strategy<Value = String> {
    prop_oneof![
        Just("0".to_string()),
        Just("-1".to_string()),
        Just("1e308".to_string()),
        Just("-1e308".to_string()),
        Just("0.0000001".to_string()),
        Just("4294967296".to_string()),
        Just("null".to_string()),
        Just("\"x\"".to_string()),
        (-1.0e6f64..1.0e6).prop_map(|v| format!("{v}")),
    ]
}

fn check(text: &str) -> Result<(), TestCaseError> {
    match TeamFile::parse(text)
        .and_then(|f| f.to_input())
        .and_then(|t| plan_team(&t))
    {
        Ok(plan) => {
            for d in &plan.divers {
                prop_assert!(d.turn_shown_value.is_finite());
            }
        }
        Err(e) => prop_assert!(!e.field.is_empty() && !e.message.is_empty()),
    }
    Ok(())
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(400))]

    #[test]
    fn any_number_replaced_never_panics(which in 0usize..40, value in hostile_number()) {
        // Find the `which`-th number in the file and replace it.
        let bytes = DEMO.as_bytes();
        let mut spans = Vec::new();
        let mut i = 0;
        while i < bytes.len() {
            if (bytes[i].is_ascii_digit() || bytes[i] == b'-') && i > 0 && (bytes[i - 1] == b' ' || bytes[i - 1] == b':') {
                let start = i;
                while i < bytes.len() && (bytes[i].is_ascii_digit() || bytes[i] == b'.' || bytes[i] == b'-' || bytes[i] == b'e') {
                    i += 1;
                }
                spans.push((start, i));
            } else {
                i += 1;
            }
        }
        prop_assume!(!spans.is_empty());
        let (a, b) = spans[which % spans.len()];
        let text = format!("{}{}{}", &DEMO[..a], value, &DEMO[b..]);
        check(&text)?;
    }

    #[test]
    fn truncated_or_garbled_files_never_panic(cut in 0usize..2000, junk in "[ -~]{0,12}") {
        let cut = cut.min(DEMO.len());
        let text = format!("{}{}", &DEMO[..cut], junk);
        check(&text)?;
    }
}
