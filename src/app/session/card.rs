//! The printable team card from the app: the same SVG as `turnsheet card --charts`,
//! written into `Exchange::card_dir`: the user's Documents (else Downloads) on the
//! desktop, `cards/` in the data directory otherwise.

use std::path::PathBuf;

use chrono::TimeZone;

use crate::formats::card_svg::{CardHeading, card_svg};
use crate::i18n::tr_with;
use crate::plan::team_charts;

use super::Session;

impl Session {
    /// Write the team's card with every pairing chart. Only from starts read today: a
    /// card of unread starts would carry turns nobody can trust. Says what happened in
    /// the status and returns the file written.
    pub fn save_card(&mut self) -> Option<PathBuf> {
        let now = self.now;
        if !self.team.turns_ready(now) {
            let why = self
                .team
                .turns_gate(self.now())
                .sentence()
                .unwrap_or_default();
            self.status.push(tr_with("No card yet. {0}", &[&why]));
            return None;
        }
        let stages = self.team.stages_blocking(now);
        if !stages.is_empty() {
            let names: Vec<&str> = stages
                .iter()
                .map(|&i| self.team.input().divers[i].name.as_str())
                .collect();
            self.status.push(tr_with(
                "No card yet: read the stage gauge of {0} in the water.",
                &[&names.join(", ")],
            ));
            return None;
        }
        let input = self.team.input();
        let charts = match team_charts(input, 2, 7) {
            Ok(c) => c,
            Err(e) => {
                self.status
                    .push(tr_with("The card could not be made: {0}", &[&e]));
                return None;
            }
        };
        let stamp = chrono::Local
            .timestamp_opt(self.now, 0)
            .single()
            .unwrap_or_else(chrono::Local::now);
        let heading = CardHeading {
            dive: None,
            date: Some(format!(
                "{} {}",
                crate::app::readings::day_month(&stamp),
                stamp.format("%Y %H:%M")
            )),
            read_at: (0..input.divers.len()).map(|i| self.read_text(i)).collect(),
            labels: self.team.set_labels(),
        };
        let svg = card_svg(&heading, input, self.team.plan(), &charts);
        let name = format!("turnsheet-card-{}.svg", stamp.format("%Y-%m-%d-%H%M%S"));
        let path = self.exchange.card_dir.join(&name);
        // The app's own card folder is made on first use (writes never make folders).
        let _ = std::fs::create_dir_all(&self.exchange.card_dir);
        match crate::storage::atomic::write_text(&path, &svg) {
            Ok(()) => {
                // Where the platform keeps files its owner can open (Android's Downloads),
                // the card goes too; the copy in the app's folder stays either way.
                let published = self
                    .exchange
                    .publish_card
                    .map(|publish| publish(&name, "image/svg+xml", svg.as_bytes()));
                self.status.push(match published {
                    None => tr_with(
                        "Team card written to {0} (open it in a browser to print).",
                        &[&path.display()],
                    ),
                    Some(Ok(place)) => tr_with(
                        "Team card saved in {0}: open it from Files or Downloads to print or share.",
                        &[&place],
                    ),
                    Some(Err(e)) => tr_with(
                        "Team card written to {0}; it could not be put into Downloads ({1}).",
                        &[&path.display(), &e],
                    ),
                });
                Some(path)
            }
            Err(e) => {
                self.status.push(tr_with(
                    "The card could not be written to {0}: {1}",
                    &[&path.display(), &e],
                ));
                None
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use crate::app::session::Session;
    use crate::storage::Store;

    #[test]
    fn a_card_only_from_starts_read_today() {
        let dir = tempfile::tempdir().unwrap();
        let mut s = Session::open(Store::new(dir.path()));
        assert_eq!(s.save_card(), None, "the demo's starts are unread");
        assert!(
            s.status.text().contains("No card yet"),
            "{}",
            s.status.text()
        );
        for i in 0..s.team.len() {
            s.confirm_start(i);
        }
        assert_eq!(s.save_card(), None, "the demo's stage starts are unread");
        assert!(
            s.status.text().contains("stage gauge"),
            "{}",
            s.status.text()
        );
        for i in 0..s.team.len() {
            if s.team.input().divers[i].stage.is_some() {
                s.team.mark_stage_read(i, s.now());
            }
        }
        let path = s.save_card().expect("a card");
        let svg = std::fs::read_to_string(&path).unwrap();
        assert!(svg.starts_with("<?xml") || svg.starts_with("<svg"));
        // Every diver's shown turn, in their unit, is on the card.
        for d in &s.team.plan().divers {
            let turn = format!("{}", d.turn_shown_value);
            assert!(svg.contains(&turn), "{} {turn}", d.name);
            assert!(svg.contains(&d.name));
        }
    }

    #[test]
    fn a_card_also_goes_where_the_platform_puts_shared_files_and_says_where() {
        use std::sync::Mutex;
        static GOT: Mutex<Vec<(String, String, usize)>> = Mutex::new(Vec::new());
        fn publish(name: &str, mime: &str, bytes: &[u8]) -> Result<String, String> {
            GOT.lock()
                .unwrap()
                .push((name.into(), mime.into(), bytes.len()));
            Ok(format!("Download/Turnsheet/{name}"))
        }
        fn refuse(_: &str, _: &str, _: &[u8]) -> Result<String, String> {
            Err("no shared storage".into())
        }
        let dir = tempfile::tempdir().unwrap();
        let mut s = Session::open(Store::new(dir.path()));
        for i in 0..s.team.len() {
            s.confirm_start(i);
            if s.team.input().divers[i].stage.is_some() {
                s.team.mark_stage_read(i, s.now());
            }
        }
        s.exchange.publish_card = Some(publish);
        let path = s.save_card().expect("a card");
        let got = GOT.lock().unwrap().clone();
        let written = std::fs::read(&path).unwrap();
        assert_eq!(got.len(), 1);
        assert_eq!(got[0].1, "image/svg+xml");
        assert_eq!(got[0].2, written.len(), "the same bytes as the card kept");
        assert!(path.ends_with(&got[0].0));
        assert!(
            s.status
                .text()
                .contains(&format!("Download/Turnsheet/{}", got[0].0)),
            "{}",
            s.status.text()
        );
        s.exchange.publish_card = Some(refuse);
        let kept = s.save_card().expect("the card is kept in the app's folder");
        assert!(kept.exists());
        assert!(
            s.status.text().contains("no shared storage"),
            "{}",
            s.status.text()
        );
    }
}
