//! What must hold after every action of the robot. The freshness rule is restated here
//! (a start is a reading of this dive for three hours of elapsed time after it was
//! taken, never from the future), and turns come from the planning core directly, so
//! the checks do not lean on the view code they check.

use slint::ComponentHandle;
use turnsheet::app::ui::{Nav, Page};
use turnsheet::plan::{TeamInput, TeamPlan, plan_team};

use super::{Robot, Seen};

const FRESH_S: i64 = 3 * 3600;

/// The facts the checks compare the screen with.
struct Truth {
    input: TeamInput,
    plan: TeamPlan,
    usable: Vec<bool>,
    all_usable: bool,
    stages_usable: bool,
    chart_pair: Option<(usize, usize)>,
}

fn truth(robot: &Robot) -> Truth {
    let s = robot.app.session.borrow();
    let state = s.team.to_state();
    let input = state.team.to_input().expect("the session's team is valid");
    let plan = plan_team(&input).expect("the session's team plans");
    let now = turnsheet::app::clock::Clock::now(&robot.clock);
    let fresh = |r: &Option<turnsheet::app::readings::StartReading>| {
        r.as_ref()
            .is_some_and(|r| (0..=FRESH_S).contains(&(now - r.at)))
    };
    let usable: Vec<bool> = (0..input.divers.len())
        .map(|i| fresh(state.start_readings.get(i).unwrap_or(&None)))
        .collect();
    let stages_usable = (0..input.divers.len()).all(|i| {
        input.divers[i].stage.is_none() || fresh(state.stage_readings.get(i).unwrap_or(&None))
    });
    Truth {
        all_usable: usable.iter().all(|u| *u),
        usable,
        stages_usable,
        chart_pair: s.chart.pair(input.divers.len()),
        input,
        plan,
    }
}

fn labelled(seen: &[Seen], prefix: &str) -> Vec<(String, String)> {
    seen.iter()
        .filter(|e| e.label.starts_with(prefix))
        .map(|e| (e.label.clone(), e.value.clone()))
        .collect()
}

/// The turns shown under `prefix` ("turn of ", "buddy turn of ") against the core.
fn check_turns(t: &Truth, shown: &[(String, String)], prefix: &str) -> Result<usize, String> {
    let mut n = 0;
    for (label, value) in shown {
        let name = &label[prefix.len()..];
        let Some(d) = t.plan.divers.iter().find(|d| d.name == name) else {
            return Err(format!("{label}: no diver {name} in the team"));
        };
        let (num, unit) = value.split_once(' ').unwrap_or((value, ""));
        if unit != d.gauge.label() {
            return Err(format!(
                "{label} = {value}: not on the gauge ({})",
                d.gauge.label()
            ));
        }
        if !t.all_usable {
            if num != "—" {
                return Err(format!(
                    "{label} = {value} while a start is not read (usable: {:?})",
                    t.usable
                ));
            }
        } else {
            let v: f64 = num
                .parse()
                .map_err(|_| format!("{label} = {value}: no turn while every start is read"))?;
            if (v - d.turn_shown_value).abs() > 1e-9 {
                return Err(format!(
                    "{label} = {value}, the core says {}",
                    d.turn_shown_value
                ));
            }
        }
        n += 1;
    }
    Ok(n)
}

/// Every check; the number of checks made, or the first violation.
pub fn check(robot: &Robot, seen: &[Seen]) -> Result<usize, String> {
    let t = truth(robot);
    let page = robot.app.window.global::<Nav>().get_page();
    let mut n = 0;
    n += check_turns(&t, &labelled(seen, "turn of "), "turn of ")?;
    n += check_turns(&t, &labelled(seen, "buddy turn of "), "buddy turn of ")?;
    let rule = format!("Rule of {}", t.input.rule.name());
    for (label, value) in labelled(seen, "rule line")
        .into_iter()
        .chain(labelled(seen, "buddy view heading"))
    {
        n += 1;
        if !value.contains(&rule) || !value.contains('°') {
            return Err(format!(
                "{label} = {value:?}: the rule ({rule}) or the water is missing"
            ));
        }
        // No allowance sum and no controlling diver named from unread starts.
        if !t.all_usable && (value.contains('÷') || value.contains(" controls:")) {
            return Err(format!("{label} = {value:?} while a start is not read"));
        }
    }
    if page == Page::Buddy && labelled(seen, "buddy view heading").is_empty() {
        return Err("the buddy view does not say its rule".into());
    }
    for (_, value) in labelled(seen, "team summary") {
        n += 1;
        if value.starts_with("Turns:") && !t.all_usable {
            return Err(format!("team summary {value:?} while a start is not read"));
        }
    }
    n += check_chart(seen, &t)?;
    n += check_cards(robot, &t)?;
    n += check_inside(robot, seen)?;
    n += check_layout(robot)?;
    Ok(n)
}

/// The whole-layout check (`layout_check`: every text readable whole, in its box, not
/// cut, not over another, reachable by scrolling) on every `LAYOUT_EVERY`th action: it
/// walks every item of the window, so it runs less often than the others.
pub const LAYOUT_EVERY: usize = 10;

fn check_layout(robot: &Robot) -> Result<usize, String> {
    let k = robot.checks_run.get() + 1;
    robot.checks_run.set(k);
    if !k.is_multiple_of(LAYOUT_EVERY) {
        return Ok(0);
    }
    let found = crate::layout_check::problems(robot.app.window.window(), "robot");
    match found.first() {
        None => Ok(1),
        Some(first) => Err(format!("{first} ({} layout problems in all)", found.len())),
    }
}

/// A boxed chart cell only from two readings of this dive, and equal to the core's turn
/// for that pair.
fn check_chart(seen: &[Seen], t: &Truth) -> Result<usize, String> {
    let boxed: Vec<String> = seen
        .iter()
        .filter(|e| e.description == "planned")
        .map(|e| e.value.clone())
        .collect();
    if boxed.is_empty() {
        return Ok(0);
    }
    let Some((me, buddy)) = t.chart_pair else {
        return Err("a boxed chart cell without a pair".into());
    };
    if !(t.usable[me] && t.usable[buddy]) {
        return Err(format!(
            "chart cell boxed while a start of the pair is not read: {:?}",
            t.usable
        ));
    }
    let mut pair = t.input.clone();
    pair.divers = vec![t.input.divers[me].clone(), t.input.divers[buddy].clone()];
    let plan = plan_team(&pair).map_err(|e| format!("pair does not plan: {e}"))?;
    let want = plan.divers[0].turn_shown_value;
    for v in &boxed {
        if v.parse::<f64>().ok() != Some(want) {
            return Err(format!("boxed chart cell {v}, the core says {want}"));
        }
    }
    Ok(boxed.len())
}

/// A card on disk only from starts (and stage starts) read for this dive.
fn check_cards(robot: &Robot, t: &Truth) -> Result<usize, String> {
    let dir = robot.dir.path().join("cards");
    let count = std::fs::read_dir(&dir).map(|d| d.count()).unwrap_or(0);
    let seen = robot.cards_seen.get();
    robot.cards_seen.set(count);
    if count > seen && !(t.all_usable && t.stages_usable) {
        return Err(format!(
            "a card was written while a start was not read: {:?}",
            t.usable
        ));
    }
    if count > seen {
        return check_card_turns(&dir, t).map(|n| n + 1);
    }
    Ok(1)
}

/// The card just written holds each diver's turn as the core plans it, on their gauge
/// ("160 bar" as one line of the card).
fn check_card_turns(dir: &std::path::Path, t: &Truth) -> Result<usize, String> {
    let newest = std::fs::read_dir(dir)
        .map_err(|e| e.to_string())?
        .flatten()
        .max_by_key(|e| e.metadata().and_then(|m| m.modified()).ok())
        .ok_or("no card in the cards folder")?;
    let svg = std::fs::read_to_string(newest.path()).map_err(|e| e.to_string())?;
    let lines: Vec<String> = svg
        .split("<text")
        .skip(1)
        .filter_map(|t| {
            let body = &t[t.find('>')? + 1..];
            Some(body[..body.find("</text>")?].replace('\u{a0}', " "))
        })
        .collect();
    for d in &t.plan.divers {
        let turn = format!(
            "{} {}",
            turnsheet::plan::shown::turn(d.turn_shown_value),
            d.gauge.label()
        );
        if !lines.iter().any(|l| l.trim() == turn) {
            return Err(format!(
                "the card {:?} does not show the turn of {} as {turn:?}",
                newest.file_name(),
                d.name
            ));
        }
    }
    Ok(t.plan.divers.len())
}

/// No text or control past the left or right edge of the window.
fn check_inside(robot: &Robot, seen: &[Seen]) -> Result<usize, String> {
    let (w, h) = robot.size;
    let mut n = 0;
    for e in seen {
        if e.w <= 0.0 || e.y + e.h <= 0.0 || e.y >= h {
            continue;
        }
        n += 1;
        if e.x < -0.5 || e.x + e.w > w + 0.5 {
            return Err(format!(
                "{:?} from x = {:.0} to {:.0} leaves a {w:.0} px window",
                e.label,
                e.x,
                e.x + e.w
            ));
        }
    }
    Ok(n)
}
