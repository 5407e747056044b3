//! The cautions shown on first launch and in Settings.

use crate::i18n::tr;

/// The cautions, one paragraph each, in the language shown.
pub fn cautions() -> Vec<String> {
    vec![
        tr(
            "Turnsheet is a planning aid for trained cave and wreck divers. It does not replace training, and it is not a dive computer.",
        ),
        tr(
            "Your team's protocol, your training agency's standards and the site's rules come first. Where they differ from this app, follow them.",
        ),
        tr(
            "Check the numbers by hand before you dive. A wrong number here can leave a teammate without gas.",
        ),
        tr(
            "The answer is only as good as the inputs: the stamped water capacity or rating, the gauge's accuracy, bar versus psi, the gas actually in each cylinder, and pressures read once the cylinders have reached water temperature.",
        ),
        tr(
            "Thirds is a minimum. Siphons, restrictions, low visibility, scooters, cold water, stress and long exits call for a stricter fraction.",
        ),
        tr(
            "Turn the dive at the first limit reached: the first diver at their turn pressure, time, decompression, a problem, or any diver calling it.",
        ),
        tr(
            "Turnsheet does not plan decompression, oxygen exposure or gas for stages beyond what you enter.",
        ),
        tr(
            "No warranty: you use this software at your own risk (GPL-3.0-or-later, sections 15 and 16).",
        ),
    ]
}
