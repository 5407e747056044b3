//! Fuzzing with proptest: the team-file parser, the SPEC parser, the planner (through
//! team files), the direct real-gas inverse (against the bisection), the locker file (the
//! app's reader) and the import file, set names and notes, and the card (every name the
//! checks accept gives well-formed XML).
//!
//! The normal suite runs a short pass of each. The long pass (100,000 cases each) is
//! ignored by default:
//!
//!     cargo test --release --test fuzz -- --ignored --nocapture
//!
//! `TURNSHEET_FUZZ_CASES` overrides the long pass's count.

use proptest::prelude::*;
use proptest::test_runner::{Config, TestRunner};
use serde_json::{Value, json};
use turnsheet::formats::cylinder_spec::{format_cylinder_spec, parse_cylinder_spec};
use turnsheet::formats::team_file::TeamFile;
use turnsheet::plan::{ContentModel, Mix, Pressure, RealGasModel, Temperature, Volume, plan_team};
use turnsheet::plan::{MAX_MODEL_PRESSURE_BAR, bracketed_pressure};

const DEMO: &str = include_str!("../examples/hollowmere-team.json");
const SHORT: u32 = 300;
const LONG: u32 = 100_000;

fn long_cases() -> u32 {
    std::env::var("TURNSHEET_FUZZ_CASES")
        .ok()
        .and_then(|s| s.parse().ok())
        .unwrap_or(LONG)
}

/// Run `test` over `cases` values of `strategy`; print the count for the record. `test`
/// returns whether the input was accepted (parsed, or planned). Runs on a
/// thread with a large stack: building values of the nested team strategies takes more
/// than a test thread's default stack in debug builds.
fn fuzz<S>(
    name: &'static str,
    cases: u32,
    strategy: S,
    test: impl Fn(S::Value) -> Result<bool, TestCaseError> + Send + 'static,
) where
    S: Strategy + Send + 'static,
    S::Value: std::fmt::Debug,
{
    let worker = std::thread::Builder::new()
        .stack_size(256 * 1024 * 1024)
        .spawn(move || {
            let mut config = Config::with_cases(cases);
            config.failure_persistence = None;
            config.max_global_rejects = cases;
            let mut runner = TestRunner::new(config);
            let accepted = std::sync::atomic::AtomicU64::new(0);
            let t0 = std::time::Instant::now();
            let result = runner.run(&strategy, |v| {
                if test(v)? {
                    accepted.fetch_add(1, std::sync::atomic::Ordering::Relaxed);
                }
                Ok(())
            });
            if let Err(e) = result {
                panic!("{name}: {e}");
            }
            eprintln!(
                "fuzz {name}: {cases} cases passed in {:.1} s ({} accepted, the rest refused with a named field)",
                t0.elapsed().as_secs_f64(),
                accepted.into_inner()
            );
        })
        .unwrap();
    if let Err(e) = worker.join() {
        std::panic::resume_unwind(e);
    }
}

// ---- team files -------------------------------------------------------------------

/// Parse, convert and plan; never a panic; a plan keeps its promises; an error names a field.
fn check_team_text(text: &str) -> Result<bool, TestCaseError> {
    match TeamFile::parse(text)
        .and_then(|f| f.to_input())
        .and_then(|t| plan_team(&t).map(|p| (t, p)))
    {
        Ok((_, plan)) => {
            prop_assert!(!plan.divers.is_empty());
            for d in &plan.divers {
                let (turn, start) = (d.turn_shown.bar(), d.start.bar());
                prop_assert!(d.turn_shown_value.is_finite(), "{d:?}");
                prop_assert!(turn.is_finite() && turn >= 0.0, "{d:?}");
                prop_assert!(turn <= start + 1e-9, "turn above start: {d:?}");
                // The shown turn is the higher exact turn rounded up, unless capped at start.
                let exact = d.turn_real.bar().max(d.turn_hand.bar());
                prop_assert!(
                    turn >= exact - 1e-6 || (turn - start).abs() < 1e-9,
                    "turn below the exact turns: {d:?}"
                );
                prop_assert!((0.0..=MAX_MODEL_PRESSURE_BAR).contains(&d.turn_real.bar()));
            }
            prop_assert_eq!(plan.divers.iter().filter(|d| d.controlling).count(), 1);
            Ok(true)
        }
        Err(e) => {
            prop_assert!(!e.field.is_empty(), "{e:?}");
            prop_assert!(!e.message.is_empty(), "{e:?}");
            Ok(false)
        }
    }
}

fn hostile_number() -> impl Strategy<Value = Value> {
    prop_oneof![
        4 => (-1.0e3f64..1.0e3).prop_map(|v| json!(v)),
        4 => (0.0f64..500.0).prop_map(|v| json!(v)),
        1 => prop::sample::select(vec![
            0.0, -0.0, 1e-310, 5e-324, 1e308, -1e308, f64::MAX, 4294967296.0, 0.4, 0.999_999,
        ])
        .prop_map(|v| json!(v)),
        1 => any::<i64>().prop_map(|v| json!(v)),
        1 => any::<u64>().prop_map(|v| json!(v)),
        1 => Just(Value::Null),
        1 => ".{0,8}".prop_map(Value::String),
        1 => Just(json!([])),
        1 => Just(json!({})),
    ]
}

fn cylinders_value() -> impl Strategy<Value = Value> {
    prop_oneof![
        (0u64..6, 0.0f64..35.0, 0.0f64..450.0)
            .prop_map(|(c, w, p)| json!({"count": c, "water_l": w, "working_bar": p})),
        (0u64..6, 0.0f64..150.0, 0.0f64..6000.0)
            .prop_map(|(c, v, p)| json!({"count": c, "rated_cuft": v, "rated_psi": p})),
        (hostile_number(), hostile_number())
            .prop_map(|(w, p)| json!({"water_l": w, "working_bar": p})),
        (hostile_number(), hostile_number(), hostile_number(), hostile_number()).prop_map(
            |(a, b, c, d)| json!({"water_l": a, "working_bar": b, "rated_cuft": c, "rated_psi": d})
        ),
    ]
}

fn mix_value() -> impl Strategy<Value = Value> {
    prop_oneof![
        (0.0f64..1.05, 0.0f64..1.0).prop_map(|(o2, he)| json!({"o2": o2, "he": he})),
        (hostile_number(), hostile_number()).prop_map(|(o2, he)| json!({"o2": o2, "he": he})),
        Just(json!({})),
    ]
}

fn diver_value() -> impl Strategy<Value = Value> {
    (
        prop_oneof![
            Just("Ines".to_string()),
            Just("Bram".to_string()),
            ".{0,30}"
        ],
        cylinders_value(),
        mix_value(),
        prop_oneof![3 => (0.0f64..450.0).prop_map(|v| json!(v)), 1 => hostile_number()],
        prop::option::of(prop_oneof![
            (0.0f64..60.0).prop_map(|v| json!(v)),
            hostile_number()
        ]),
        prop::option::weighted(0.3, (cylinders_value(), mix_value(), 0.0f64..450.0)),
    )
        .prop_map(|(name, cylinders, mix, start, sac, stage)| {
            let mut d = json!({"name": name, "cylinders": cylinders, "mix": mix, "start": start});
            if let Some(sac) = sac {
                d["sac"] = sac;
            }
            if let Some((c, m, s)) = stage {
                d["stage"] = json!({"cylinders": c, "mix": m, "start": s});
            }
            d
        })
}

fn team_value() -> impl Strategy<Value = Value> {
    (
        prop::sample::select(vec!["metric", "imperial", "cubits"]),
        prop::sample::select(vec![
            "thirds", "quarters", "halves", "sixths", "fifths", "tenths",
        ]),
        prop::option::of(prop_oneof![
            3 => prop::sample::select(vec![1.0, 5.0, 10.0, 50.0, 100.0]).prop_map(|v| json!(v)),
            1 => hostile_number(),
        ]),
        prop::option::of(prop_oneof![
            (-5.0f64..100.0).prop_map(|v| json!(v)),
            hostile_number()
        ]),
        prop::option::of(prop_oneof![
            (0.0f64..200.0).prop_map(|v| json!(v)),
            hostile_number()
        ]),
        prop::sample::select(vec!["fresh", "salt", "brine"]),
        prop::collection::vec(diver_value(), 0..8),
    )
        .prop_map(|(units, rule, step, temp, depth, water, divers)| {
            let mut t = json!({"units": units, "rule": rule, "water": water, "divers": divers});
            if let Some(s) = step {
                t["gauge_step"] = s;
            }
            if let Some(x) = temp {
                t["water_temp"] = x;
            }
            if let Some(x) = depth {
                t["depth"] = x;
            }
            t
        })
}

/// Edits of the demo file's text: cut, insert or replace a few characters anywhere.
fn demo_edit() -> impl Strategy<Value = String> {
    let chars: Vec<char> = DEMO.chars().collect();
    let n = chars.len();
    (prop::collection::vec((0..n, 0usize..4, "(?s).{0,3}"), 1..6),).prop_map(move |(edits,)| {
        let mut c = chars.clone();
        for (at, cut, insert) in edits {
            let at = at.min(c.len());
            let end = (at + cut).min(c.len());
            c.splice(at..end, insert.chars());
        }
        c.into_iter().collect()
    })
}

fn team_text() -> impl Strategy<Value = String> {
    prop_oneof![
        2 => team_value().prop_map(|v| v.to_string()),
        2 => demo_edit(),
        1 => ".{0,200}",
        1 => "[\\[\\]{}\":,0-9a-z .eE+-]{0,200}",
    ]
}

/// Valid demo teams with random starts, mixes and temperatures: the plan succeeds or names
/// a field, and when it succeeds it keeps its promises (checked in `check_team_text`).
fn planner_team() -> impl Strategy<Value = Value> {
    let demo: Value = serde_json::from_str(DEMO).unwrap();
    (
        prop::collection::vec((0.3f64..1.3, 0.21f64..0.40, 0.0f64..0.5), 3),
        prop::sample::select(vec!["thirds", "quarters", "halves", "sixths", "fifths"]),
        0.0f64..35.0,
        prop::sample::select(vec![1.0, 2.0, 5.0, 10.0, 20.0]),
    )
        .prop_map(move |(fills, rule, temp, step)| {
            let mut t = demo.clone();
            t["rule"] = json!(rule);
            t["water_temp"] = json!(temp);
            t["gauge_step"] = json!(step);
            for (i, (fill, o2, he)) in fills.into_iter().enumerate() {
                let d = &mut t["divers"][i];
                let wp = d["cylinders"]["working_bar"].as_f64().unwrap_or(232.0);
                d["start"] = json!((wp * fill).clamp(1.0, 399.0));
                d["mix"] = json!({"o2": o2, "he": he.min(1.0 - o2)});
            }
            t
        })
}

// ---- cylinder specs ------------------------------------------------------------------

fn spec_text() -> impl Strategy<Value = String> {
    let number = prop_oneof![
        (0u32..500).prop_map(|v| v.to_string()),
        (0.0f64..500.0).prop_map(|v| format!("{v:.1}")),
        "[0-9.,]{0,6}",
    ];
    let size_unit = prop::sample::select(vec!["L", "l", "cuft", "cu ft", "ft3", "", "gal", "bar"]);
    let rating_unit = prop::sample::select(vec!["bar", "BAR", "psi", "", "atm", "L"]);
    // Sets in range, written the ways people write them.
    let plausible = (
        1u8..=4,
        prop::bool::ANY,
        0.5f64..=30.0,
        50.0f64..=400.0,
        10.0f64..=130.0,
        2000.0f64..=3600.0,
        prop::sample::select(vec!["x", "X", " x ", "×"]),
        prop::sample::select(vec!["L", "l", " L"]),
        prop::sample::select(vec!["bar", "BAR", " bar"]),
        prop::bool::ANY,
    )
        .prop_map(|(count, metric, w, bar, cuft, psi, x, l, b, comma)| {
            let text = if metric {
                format!("{count}{x}{w:.1}{l}@{bar:.0}{b}")
            } else {
                format!("{count}{x}{cuft:.1}cu ft @ {psi:.0}psi")
            };
            if comma { text.replace('.', ",") } else { text }
        });
    prop_oneof![
        3 => plausible,
        3 => (0u32..7, number.clone(), size_unit, number, rating_unit).prop_map(
            |(count, size, su, rating, ru)| format!("{count}x{size}{su}@{rating}{ru}")
        ),
        1 => "[0-9x×X@.,LlcuftbarpsiBARPSI \\-]{0,24}",
        1 => ".{0,80}",
    ]
}

fn check_spec(text: String) -> Result<bool, TestCaseError> {
    match parse_cylinder_spec(&text) {
        Ok(set) => {
            let again = parse_cylinder_spec(&format_cylinder_spec(&set));
            prop_assert_eq!(again, Ok(set), "{} does not read back", text);
            Ok(true)
        }
        Err(e) => {
            prop_assert!(e.field.starts_with("SPEC"), "{e:?}");
            prop_assert!(!e.message.is_empty());
            if e.field == "SPEC" {
                prop_assert!(e.message.contains("COUNTxSIZE@RATING"), "{e:?}");
            }
            Ok(false)
        }
    }
}

// ---- the direct real-gas inverse ----------------------------------------------------

fn inverse_case() -> impl Strategy<Value = (f64, f64, f64, f64, f64)> {
    (
        0.05f64..=1.0,
        0.0f64..=0.95,
        -5.0f64..=45.0,
        0.5f64..=120.0,
        -0.1f64..=1.1,
    )
}

fn check_inverse(
    (o2, he, t, w, fraction): (f64, f64, f64, f64, f64),
) -> Result<bool, TestCaseError> {
    let mix = Mix {
        o2,
        he: he.min(1.0 - o2),
    };
    let m = RealGasModel::new(mix, Temperature::from_celsius(t));
    let water = Volume::from_litres(w);
    let full = m
        .content(water, Pressure::from_bar(MAX_MODEL_PRESSURE_BAR))
        .litres();
    let c = full * fraction;
    let direct = m.pressure_for(water, Volume::from_litres(c)).bar();
    let oracle = bracketed_pressure(|p| m.content(water, p).litres(), c).bar();
    prop_assert!((0.0..=MAX_MODEL_PRESSURE_BAR).contains(&direct), "{direct}");
    prop_assert!(
        (direct - oracle).abs() < 1e-6,
        "direct {direct} bar, bisection {oracle} bar"
    );
    Ok(true)
}

// ---- short passes (every run) ---------------------------------------------------------

#[test]
fn fuzz_team_file_parser_short() {
    fuzz("team file parser", SHORT, team_text(), |t| {
        check_team_text(&t)
    });
}

#[test]
fn fuzz_spec_parser_short() {
    fuzz("SPEC parser", SHORT * 3, spec_text(), check_spec);
}

#[test]
fn fuzz_planner_short() {
    fuzz("planner", SHORT, planner_team(), |t| {
        check_team_text(&t.to_string())
    });
}

#[test]
fn fuzz_direct_inverse_short() {
    fuzz("direct inverse", SHORT, inverse_case(), check_inverse);
}

// ---- long passes (--ignored) ----------------------------------------------------------

#[test]
#[ignore = "long fuzzing pass: cargo test --release --test fuzz -- --ignored"]
fn fuzz_team_file_parser_long() {
    fuzz("team file parser", long_cases(), team_text(), |t| {
        check_team_text(&t)
    });
}

#[test]
#[ignore = "long fuzzing pass: cargo test --release --test fuzz -- --ignored"]
fn fuzz_spec_parser_long() {
    fuzz("SPEC parser", long_cases(), spec_text(), check_spec);
}

#[test]
#[ignore = "long fuzzing pass: cargo test --release --test fuzz -- --ignored"]
fn fuzz_planner_long() {
    fuzz("planner", long_cases(), planner_team(), |t| {
        check_team_text(&t.to_string())
    });
}

#[test]
#[ignore = "long fuzzing pass: cargo test --release --test fuzz -- --ignored"]
fn fuzz_direct_inverse_long() {
    fuzz(
        "direct inverse",
        long_cases(),
        inverse_case(),
        check_inverse,
    );
}

// ---- the locker file, the import file, set names and notes, the card -----------------

use turnsheet::formats::card_svg::{CardHeading, card_svg};
use turnsheet::storage::Store;
use turnsheet::storage::atomic::kept_aside;
use turnsheet::storage::locker::{
    LockerFile, MAX_LOCKER_SETS, MAX_SET_NAME_CHARS, check_set_name, check_set_note,
    read_locker_file,
};

/// Text a hostile or careless file or person could give: anything printable, controls,
/// escape sequences, bidirectional controls, non-characters, decomposed letters, huge.
fn hostile_text() -> impl Strategy<Value = String> {
    prop_oneof![
        4 => "\\PC{0,45}",
        3 => any::<String>(),
        2 => prop::collection::vec(
            prop::sample::select(vec![
                "a", "Z", " ", "é", "e\u{301}", "\u{1b}[31m", "\t", "\n", "\u{0}", "\u{7f}",
                "\u{85}", "\u{202e}", "\u{2066}", "\u{2069}", "\u{200f}", "\u{ffff}",
                "\u{fdd0}", "\u{1fffe}", "\u{2028}", "<", "&", "\"", "'", "]]>", "😀",
            ]),
            0..30,
        )
        .prop_map(|v| v.concat()),
        1 => (0usize..200_000).prop_map(|n| "x".repeat(n)),
    ]
}

fn locker_entry_value() -> impl Strategy<Value = Value> {
    (
        prop_oneof![
            3 => (1u64..300).prop_map(|v| json!(v)),
            1 => prop::sample::select(vec![0u64, 1 << 53, (1 << 53) - 1, u64::MAX]).prop_map(|v| json!(v)),
            1 => hostile_number(),
        ],
        hostile_text(),
        cylinders_value(),
        prop::sample::select(vec!["steel", "aluminium", "composite", "gold", ""]),
        hostile_text(),
        any::<bool>(),
        0usize..8,
    )
        .prop_map(|(id, name, cyl, material, note, mine, drop)| {
            let mut e = json!({"id": id, "name": name, "cylinders": cyl,
                "material": material, "note": note, "mine": mine});
            // A field removed, or one added that the format does not know.
            let keys = ["id", "name", "cylinders", "material", "note", "mine"];
            if let Some(k) = keys.get(drop) {
                e.as_object_mut().unwrap().remove(*k);
            } else if drop == 7 {
                e["colour"] = json!("red");
            }
            e
        })
}

/// Locker files as bytes: valid-looking ones, mutated ones (truncated, bytes changed,
/// fields swapped), too many sets, deep nesting and plain noise.
fn locker_bytes() -> impl Strategy<Value = Vec<u8>> {
    let value = || {
        (
            prop_oneof![4 => Just(json!(1)), 1 => hostile_number()],
            prop::collection::vec(locker_entry_value(), 0..6),
        )
            .prop_map(|(schema, entries)| json!({"schema": schema, "entries": entries}))
    };
    prop_oneof![
        4 => value().prop_map(|v| v.to_string().into_bytes()),
        2 => (value(), any::<prop::sample::Index>(), any::<u8>()).prop_map(|(v, at, b)| {
            let mut bytes = serde_json::to_vec_pretty(&v).unwrap();
            let i = at.index(bytes.len().max(1));
            if i < bytes.len() {
                if b % 2 == 0 { bytes.truncate(i) } else { bytes[i] = b }
            }
            bytes
        }),
        1 => value().prop_map(|v| {
            // A field renamed, and the document followed by another one.
            let text = v.to_string().replace("\"name\"", "\"nam\"");
            format!("{text} {{}}").into_bytes()
        }),
        1 => (MAX_LOCKER_SETS - 1..MAX_LOCKER_SETS + 3).prop_map(|n| {
            let entries: Vec<Value> = (0..n)
                .map(|i| json!({"id": i + 1, "name": format!("S{i}"),
                    "cylinders": {"count": 2, "water_l": 12.0, "working_bar": 232.0}}))
                .collect();
            json!({"schema": 1, "entries": entries}).to_string().into_bytes()
        }),
        1 => (1usize..5000).prop_map(|d| {
            format!("{{\"schema\": 1, \"entries\": {}{}}}", "[".repeat(d), "]".repeat(d)).into_bytes()
        }),
        1 => prop::collection::vec(any::<u8>(), 0..300),
    ]
}

/// The app's reader (`Store::load_locker`, which sets an unreadable file aside) and the
/// import reader (`read_locker_file`, then `merge`) on the same bytes.
fn check_locker_bytes(bytes: Vec<u8>) -> Result<bool, TestCaseError> {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("locker.json");
    std::fs::write(&path, &bytes).unwrap();
    let imported = read_locker_file(&path);
    let found = Store::new(dir.path()).load_locker();
    let (locker, messages) = (found.locker, found.messages);
    prop_assert!(locker.entries.len() <= MAX_LOCKER_SETS);
    let mut ids: Vec<u64> = locker.entries.iter().map(|e| e.id).collect();
    ids.sort();
    ids.dedup();
    prop_assert_eq!(
        ids.len(),
        locker.entries.len(),
        "ids are unique once loaded"
    );
    for (i, e) in locker.entries.iter().enumerate() {
        prop_assert!(e.check_text(&format!("entries[{i}]")).is_ok(), "{e:?}");
    }
    let kept = kept_aside(dir.path(), "locker.json");
    if locker.entries.is_empty() && !kept.is_empty() {
        prop_assert_eq!(
            std::fs::read(&kept[0]).unwrap(),
            bytes.clone(),
            "kept byte-identical"
        );
        prop_assert!(
            messages
                .iter()
                .any(|m| m.contains(&*kept[0].to_string_lossy()))
        );
    }
    match imported {
        Ok(incoming) => {
            let (merged, report) = LockerFile::default()
                .merge(&incoming)
                .map_err(|e| TestCaseError::fail(e.to_string()))?;
            for (i, e) in merged.entries.iter().enumerate() {
                prop_assert!(e.check_text(&format!("entries[{i}]")).is_ok(), "{e:?}");
                prop_assert!(!e.mine);
            }
            for (name, why) in &report.skipped {
                prop_assert!(!why.is_empty());
                prop_assert!(
                    name.chars()
                        .all(|c| turnsheet::plan::text::refused_char(c).is_none()),
                    "a skipped name is shown safely: {name:?}"
                );
            }
            Ok(true)
        }
        Err(e) => {
            prop_assert!(!e.field.is_empty() && !e.message.is_empty(), "{e:?}");
            Ok(false)
        }
    }
}

/// A set's name and note: accepted only without a refused character and within the
/// limits; refused with the field named.
fn check_set_text(text: String) -> Result<bool, TestCaseError> {
    let clean = text
        .trim()
        .chars()
        .all(|c| turnsheet::plan::text::refused_char(c).is_none());
    let n = text.trim().chars().count();
    match check_set_name("NAME", &text) {
        Ok(()) => prop_assert!(clean && (1..=MAX_SET_NAME_CHARS).contains(&n)),
        Err(e) => prop_assert_eq!(e.field, "NAME"),
    }
    match check_set_note("--note", &text) {
        Ok(()) => prop_assert!(clean),
        Err(e) => {
            prop_assert_eq!(&e.field, "--note");
            prop_assert!(!e.message.contains('\u{1b}'), "{}", e.message);
        }
    }
    let mut l = turnsheet::app::locker_controller::LockerController::default();
    let set = parse_cylinder_spec("2x12L@232bar").unwrap();
    let added = l.add_set(&text, &set, Default::default());
    prop_assert!(added.is_ok(), "{added:?}");
    prop_assert!(
        l.entries()[0].check_text("entries[0]").is_ok(),
        "{:?}",
        l.entries()
    );
    Ok(check_set_name("NAME", &text).is_ok())
}

/// Any diver name (and dive name) the checks accept gives a well-formed card; any other
/// is refused naming the field.
fn check_card_name((name, dive): (String, String)) -> Result<bool, TestCaseError> {
    let mut team: Value = serde_json::from_str(DEMO).unwrap();
    team["divers"][0]["name"] = json!(name);
    let input = TeamFile::parse(&team.to_string()).and_then(|f| f.to_input());
    let planned = input.and_then(|t| plan_team(&t).map(|p| (t, p)));
    match planned {
        Ok((t, p)) => {
            let dive = turnsheet::plan::text::check_text("--dive", &dive)
                .ok()
                .map(|()| dive);
            let heading = CardHeading {
                dive,
                date: Some("today".into()),
                read_at: vec!["read 09:42".into(); t.divers.len()],
                labels: Default::default(),
            };
            let svg = card_svg(&heading, &t, &p, &[]);
            let doc = roxmltree::Document::parse(&svg);
            prop_assert!(doc.is_ok(), "not well-formed: {:?}", doc.err());
            let text: String = doc
                .unwrap()
                .descendants()
                .filter_map(|n| n.text())
                .collect();
            prop_assert!(
                text.contains(t.divers[0].name.trim()),
                "the name is on the card"
            );
            Ok(true)
        }
        Err(e) => {
            prop_assert!(e.field.starts_with("divers[0].name"), "{e}");
            Ok(false)
        }
    }
}

#[test]
fn fuzz_locker_and_import_files_short() {
    fuzz(
        "locker and import files",
        SHORT,
        locker_bytes(),
        check_locker_bytes,
    );
}

#[test]
fn fuzz_set_names_and_notes_short() {
    fuzz(
        "set names and notes",
        SHORT * 3,
        hostile_text(),
        check_set_text,
    );
}

#[test]
fn fuzz_card_names_short() {
    fuzz(
        "card names",
        SHORT,
        (hostile_text(), hostile_text()),
        check_card_name,
    );
}

#[test]
#[ignore = "long fuzzing pass: cargo test --release --test fuzz -- --ignored"]
fn fuzz_locker_and_import_files_long() {
    fuzz(
        "locker and import files",
        long_cases(),
        locker_bytes(),
        check_locker_bytes,
    );
}

#[test]
#[ignore = "long fuzzing pass: cargo test --release --test fuzz -- --ignored"]
fn fuzz_set_names_and_notes_long() {
    fuzz(
        "set names and notes",
        long_cases(),
        hostile_text(),
        check_set_text,
    );
}

#[test]
#[ignore = "long fuzzing pass: cargo test --release --test fuzz -- --ignored"]
fn fuzz_card_names_long() {
    fuzz(
        "card names",
        long_cases(),
        (hostile_text(), hostile_text()),
        check_card_name,
    );
}
