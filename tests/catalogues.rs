//! The gettext catalogues (lang/) against the messages the code uses.
//!
//! The messages are found in the sources: `@tr("…")` in the Slint views, `tr("…")`,
//! `tr_with("…", …)` and `tr_n("…", "…", …)` in the Rust code. Every one must be in
//! the template `lang/turnsheet.pot` and translated in every language's catalogue,
//! with the same placeholders (`{0}`, `{n}`, …) as the English.
//!
//! After adding or changing messages, `TURNSHEET_UPDATE_CATALOGUES=1 cargo test --test
//! catalogues` rewrites the template and adds the new messages, untranslated, to each
//! catalogue (translations already there are kept); the test then names what is left
//! to translate.

use std::collections::{BTreeMap, BTreeSet};
use std::path::{Path, PathBuf};

use turnsheet::i18n::{Language, catalogues, placeholders};

/// A message as the code uses it: its English text and, for a count, its plural.
#[derive(Clone, Debug, PartialEq, Eq, PartialOrd, Ord)]
struct Message {
    msgid: String,
    plural: Option<String>,
}

fn files(dir: &Path, ext: &str, out: &mut Vec<PathBuf>) {
    for e in std::fs::read_dir(dir).unwrap().flatten() {
        let p = e.path();
        if p.is_dir() {
            files(&p, ext, out);
        } else if p.extension().is_some_and(|x| x == ext) {
            out.push(p);
        }
    }
}

/// The string literal at the start of `s` (after spaces): its text, unescaped, and
/// the rest after it.
fn literal(s: &str) -> Option<(String, &str)> {
    let s = s.trim_start();
    let mut chars = s.strip_prefix('"')?.char_indices();
    let mut text = String::new();
    while let Some((i, c)) = chars.next() {
        match c {
            '"' => return Some((text, &s[i + 2..])),
            '\\' => match chars.next()?.1 {
                'n' => text.push('\n'),
                't' => text.push('\t'),
                other => text.push(other),
            },
            c => text.push(c),
        }
    }
    None
}

/// The messages of one source file.
fn messages_in(text: &str, slint: bool) -> Vec<Message> {
    let mut found = Vec::new();
    let calls: &[&str] = if slint {
        &["@tr("]
    } else {
        &["tr(", "tr_with(", "tr_n("]
    };
    for call in calls {
        let mut rest = text;
        while let Some(at) = rest.find(call) {
            let before = rest[..at].chars().last();
            rest = &rest[at + call.len()..];
            // `tr(` inside another word (`attr(`, `i18n::tr(` is fine).
            if !slint && before.is_some_and(|c| c.is_alphanumeric() || c == '_') {
                continue;
            }
            let Some((msgid, after)) = literal(rest) else {
                continue;
            };
            let plural = if *call == "tr_n(" {
                literal(after.trim_start().trim_start_matches(',')).map(|p| p.0)
            } else if slint {
                after
                    .trim_start()
                    .strip_prefix('|')
                    .and_then(literal)
                    .map(|p| p.0)
            } else {
                None
            };
            found.push(Message { msgid, plural });
        }
    }
    found
}

/// Every message the code uses, with the files it is in.
fn used() -> BTreeMap<Message, BTreeSet<String>> {
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let mut all = BTreeMap::<Message, BTreeSet<String>>::new();
    for (dir, ext) in [("ui", "slint"), ("src", "rs")] {
        let mut list = Vec::new();
        files(&root.join(dir), ext, &mut list);
        list.sort();
        for f in list {
            let text = std::fs::read_to_string(&f).unwrap();
            let name = f.strip_prefix(root).unwrap().display().to_string();
            // The i18n module's own tests use messages nobody translates.
            if name.starts_with("src/i18n") {
                continue;
            }
            for m in messages_in(&text, ext == "slint") {
                all.entry(m).or_default().insert(name.clone());
            }
        }
    }
    all
}

fn escape(s: &str) -> String {
    s.replace('\\', "\\\\")
        .replace('"', "\\\"")
        .replace('\n', "\\n")
        .replace('\t', "\\t")
}

/// The translations a catalogue holds: msgid → forms (one, or the plural forms).
fn translations(text: &str) -> BTreeMap<String, Vec<String>> {
    let file = rspolib::pofile(text).expect("a catalogue that parses");
    file.entries
        .into_iter()
        .filter(|e| !e.obsolete)
        .map(|e| {
            let forms = if e.msgid_plural.is_some() {
                e.msgstr_plural.clone()
            } else {
                vec![e.msgstr.clone().unwrap_or_default()]
            };
            (e.msgid, forms)
        })
        .collect()
}

fn header(po: &str) -> String {
    // Everything before the first message after the header entry.
    let mut out = String::new();
    let mut seen_header = false;
    for line in po.lines() {
        if line.starts_with("#:") || (seen_header && line.starts_with("msgid ")) {
            break;
        }
        if line.starts_with("msgid \"\"") {
            seen_header = true;
        }
        out.push_str(line);
        out.push('\n');
    }
    out
}

fn write_entries(
    out: &mut String,
    used: &BTreeMap<Message, BTreeSet<String>>,
    have: &BTreeMap<String, Vec<String>>,
) {
    for (m, where_) in used {
        let refs: Vec<&str> = where_.iter().map(|s| s.as_str()).collect();
        out.push_str(&format!("\n#: {}\n", refs.join(" ")));
        out.push_str(&format!("msgid \"{}\"\n", escape(&m.msgid)));
        let forms = have.get(&m.msgid).cloned().unwrap_or_default();
        match &m.plural {
            None => out.push_str(&format!(
                "msgstr \"{}\"\n",
                escape(forms.first().map(|s| s.as_str()).unwrap_or(""))
            )),
            Some(p) => {
                out.push_str(&format!("msgid_plural \"{}\"\n", escape(p)));
                for k in 0..2 {
                    out.push_str(&format!(
                        "msgstr[{k}] \"{}\"\n",
                        escape(forms.get(k).map(|s| s.as_str()).unwrap_or(""))
                    ));
                }
            }
        }
    }
}

fn lang_dir() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("lang")
}

fn update(used: &BTreeMap<Message, BTreeSet<String>>) {
    let mut pot = String::from(
        "# Turnsheet: every message of the app and the card, in English (the template).\n\
         # Written by `TURNSHEET_UPDATE_CATALOGUES=1 cargo test --test catalogues`.\n\
         msgid \"\"\nmsgstr \"\"\n\"Content-Type: text/plain; charset=UTF-8\\n\"\n",
    );
    write_entries(&mut pot, used, &BTreeMap::new());
    std::fs::write(lang_dir().join("turnsheet.pot"), pot).unwrap();
    for (l, text) in catalogues() {
        // The header without the blank lines before the first message (each message
        // brings its own), so an update adds none.
        let mut po = header(text).trim_end().to_string() + "\n";
        write_entries(&mut po, used, &translations(text));
        let path = lang_dir()
            .join(l.code())
            .join("LC_MESSAGES")
            .join("turnsheet.po");
        std::fs::write(path, po).unwrap();
    }
}

#[test]
fn every_message_is_translated_in_every_language() {
    let used = used();
    assert!(
        used.len() > 100,
        "the sources hold {} messages: the finder is broken",
        used.len()
    );
    if std::env::var_os("TURNSHEET_UPDATE_CATALOGUES").is_some() {
        update(&used);
        eprintln!("template and catalogues rewritten; rebuild so the binary embeds them");
        return;
    }
    // The template is the code's list, neither more nor less.
    let pot = std::fs::read_to_string(lang_dir().join("turnsheet.pot")).unwrap();
    let in_pot: BTreeSet<String> = translations(&pot).into_keys().collect();
    let in_code: BTreeSet<String> = used.keys().map(|m| m.msgid.clone()).collect();
    let missing: Vec<_> = in_code.difference(&in_pot).collect();
    let stale: Vec<_> = in_pot.difference(&in_code).collect();
    assert!(
        missing.is_empty() && stale.is_empty(),
        "lang/turnsheet.pot is out of date (run with TURNSHEET_UPDATE_CATALOGUES=1): \
         not in it {missing:?}; no longer used {stale:?}"
    );
    let mut problems = Vec::new();
    let mut coverage = Vec::new();
    for (l, text) in catalogues() {
        let have = translations(text);
        let mut done = 0;
        for m in used.keys() {
            let want = placeholders(&m.msgid);
            match have.get(&m.msgid) {
                Some(forms) if !forms.is_empty() && forms.iter().all(|f| !f.is_empty()) => {
                    done += 1;
                    for f in forms {
                        let mut got = placeholders(f);
                        let mut expect = want.clone();
                        if m.plural.is_some() {
                            // A form may leave out the count ("un plongeur").
                            got.retain(|p| p != "{n}");
                            expect.retain(|p| p != "{n}");
                        }
                        if got != expect {
                            problems.push(format!(
                                "{}: {:?} has placeholders {got:?}, the English {expect:?}",
                                l.code(),
                                f
                            ));
                        }
                    }
                }
                _ => problems.push(format!("{}: not translated: {:?}", l.code(), m.msgid)),
            }
        }
        coverage.push(format!("{} {done}/{}", l.code(), used.len()));
    }
    eprintln!("catalogue coverage: {}", coverage.join(", "));
    assert!(
        problems.is_empty(),
        "{} problems, first 40:\n{}",
        problems.len(),
        problems
            .iter()
            .take(40)
            .cloned()
            .collect::<Vec<_>>()
            .join("\n")
    );
}

#[test]
fn every_language_has_its_catalogue_and_plural_rule() {
    let found: Vec<Language> = catalogues().into_iter().map(|c| c.0).collect();
    for l in Language::ALL
        .into_iter()
        .filter(|l| *l != Language::English)
    {
        assert!(found.contains(&l), "{l:?} has no catalogue");
        let text = catalogues().into_iter().find(|c| c.0 == l).unwrap().1;
        let file = rspolib::pofile(text).expect("parses");
        let rule = file
            .metadata
            .get("Plural-Forms")
            .cloned()
            .unwrap_or_default();
        // The header's rule and the one the Rust side uses agree (gettext manual,
        // "Plural forms": n > 1 for French and Brazilian Portuguese, n != 1 here else).
        let expected = if l.plural_index(0) == 0 {
            "plural=(n > 1);"
        } else {
            "plural=(n != 1);"
        };
        assert!(rule.contains(expected), "{l:?}: {rule}");
        assert!(
            file.metadata.get("Language").is_some_and(|c| c == l.code()),
            "{l:?}: the header names another language"
        );
    }
}

#[test]
fn no_message_makes_a_possessive_of_a_name() {
    // "{0}'s start" reads "Me's start" or "Chris's start": a name is never given an
    // apostrophe-s, in English or in a catalogue.
    let used = used();
    let mut found = Vec::new();
    for m in used.keys() {
        for text in std::iter::once(&m.msgid).chain(&m.plural) {
            for mark in ["}'s", "}’s"] {
                if text.contains(mark) {
                    found.push(format!("msgid {text:?}"));
                }
            }
        }
    }
    for (l, text) in catalogues() {
        for (msgid, forms) in translations(text) {
            for f in forms {
                if f.contains("}'s") || f.contains("}’s") {
                    found.push(format!("{}: {msgid:?} → {f:?}", l.code()));
                }
            }
        }
    }
    assert!(
        found.is_empty(),
        "possessives of a name:\n{}",
        found.join("\n")
    );
}
