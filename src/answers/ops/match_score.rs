//! `match_score`: the score of a two-sided contest, named by the match or
//! by one of its teams: the final result, the score now, when it is due,
//! or that it is postponed, abandoned or suspended.

use super::support::{staleness, updated_value, when_value};
use super::team_support::{matches_of, score_value};
use super::*;
use crate::dataset::Status;

pub static SPEC: OpSpec = OpSpec {
    name: "match_score",
    summary: "the score or result of a match, by the match or by a team",
    params: &[
        Param {
            name: "contest",
            kind: EntityKind::Contest,
            required: false,
        },
        Param {
            name: "group",
            kind: EntityKind::Group,
            required: false,
        },
    ],
    outcomes: &[
        answered(
            "won",
            &["match", "score", "winner", "loser", "start", "round"],
        ),
        // Level on the score, decided another way (penalties, away goals):
        // the side placed first goes through.
        answered(
            "won_level",
            &["match", "score", "winner", "loser", "start", "round"],
        ),
        answered("drawn", &["match", "score", "start", "round"]),
        so_far(
            "live",
            &[
                "match", "score", "leader", "level", "updated", "stale", "round",
            ],
        ),
        answered("suspended", &["match", "score", "round"]),
        answered("abandoned", &["match", "score", "start", "round"]),
        no_data("postponed", &["match", "start", "round"]),
        no_data("scheduled", &["match", "start", "venue", "round"]),
        no_data("no_match", &["name"]),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let ci = match (input.contest("contest"), input.entity("group")) {
        (Some(ci), _) => ci,
        (None, Some(EntityRef::Group(g))) => match pick(input, g) {
            Some(ci) => ci,
            None => {
                let f = Facts::new().set("name", data.group_name_value(g));
                return OpOutput::done("no_match", f, vec![EntityRef::Group(g)]);
            }
        },
        _ => {
            return OpOutput::Choose {
                slot: "contest",
                options: vec![],
            }
        }
    };
    let c = &data.contests[ci];
    let me = EntityRef::Contest(ci);
    let Some(line) = data.score_line(ci) else {
        // Not a match between two sides: nothing this operation can say.
        let f = Facts::new().set("name", data.contest_name(ci));
        return OpOutput::done("no_match", f, vec![me]);
    };
    let mut mentioned = vec![me];
    mentioned.extend(
        [line.home, line.away]
            .iter()
            .filter_map(|&i| data.entry_group(&c.entries[i]).map(EntityRef::Group)),
    );
    let mut f = Facts::new()
        .set("match", data.contest_name(ci))
        .set("start", when_value(&data.facts[ci].start, input.now))
        .set("score", score_value(data, ci, &line));
    if let Some(r) = &c.round {
        f.put("round", Value::Text(r.clone()));
    }
    let outcome = match c.status {
        Status::Scheduled => {
            if let Some(v) = &c.venue {
                f.put("venue", Value::Text(v.clone()));
            }
            "scheduled"
        }
        Status::Postponed => "postponed",
        Status::Abandoned => "abandoned",
        Status::Suspended => "suspended",
        Status::Live => {
            if let Some(t) = updated_value(data, ci) {
                f.put("updated", t);
            }
            if let Some(s) = staleness(data, ci, input.now, input.stale_after) {
                f.put("stale", s);
            }
            match line.scores() {
                Some((h, a)) if h != a => {
                    let lead = if h > a { line.home } else { line.away };
                    f.put("leader", Value::Text(data.entry_name(&c.entries[lead])));
                }
                Some(_) => f.put("level", Value::Int(1)),
                None => {}
            }
            "live"
        }
        Status::Final => {
            let first = c.entries.iter().position(|e| e.place == Some(1));
            let both_first = c.entries.iter().all(|e| e.place == Some(1));
            match first {
                Some(w) if !both_first => {
                    f.put("winner", Value::Text(data.entry_name(&c.entries[w])));
                    f.put(
                        "loser",
                        Value::Text(data.entry_name(&c.entries[line.other(w)])),
                    );
                    let level = line.scores().is_some_and(|(h, a)| h == a);
                    if level {
                        "won_level"
                    } else {
                        "won"
                    }
                }
                _ => "drawn",
            }
        }
    };
    OpOutput::done(outcome, f, mentioned)
}

/// The match a reader most likely means by a team: one under way (or
/// stopped for now), else one on today, else the latest one started, else
/// the next one due.
fn pick(input: &OpInput, g: usize) -> Option<usize> {
    let data = input.data;
    let all = matches_of(data, g);
    let now = input.now.timestamp();
    if let Some(&(ci, _)) = all
        .iter()
        .find(|(ci, _)| matches!(data.contests[*ci].status, Status::Live | Status::Suspended))
    {
        return Some(ci);
    }
    // A match on today (played earlier, due later or called off) is the
    // one "the Ambervale game" means on a matchday.
    let today = input.now.date();
    if let Some(&(ci, _)) = all
        .iter()
        .find(|(ci, _)| data.facts[*ci].start.date() == today)
    {
        return Some(ci);
    }
    let started = all.iter().rev().find(|(ci, _)| {
        matches!(data.contests[*ci].status, Status::Final | Status::Abandoned)
            && data.facts[*ci].start.timestamp() <= now
    });
    started
        .or_else(|| {
            all.iter()
                .find(|(ci, _)| data.facts[*ci].start.timestamp() > now)
        })
        .map(|&(ci, _)| ci)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::answers::ops::testing::{entity, run_with};
    use crate::answers::value::Style;
    use crate::dataset::sides::testing::league;

    fn run_on(d: &Dataset, slot: (&str, EntityRef)) -> (String, HashMap<String, Value>) {
        let mut slots = Slots::new();
        slots.insert(slot.0.into(), entity(slot.1));
        match run_with(run, d, &slots) {
            OpOutput::Done { outcome, facts, .. } => (outcome.to_string(), facts),
            other => panic!("{other:?}"),
        }
    }

    #[test]
    fn each_status_has_its_outcome() {
        let d = league(
            &["ash", "birch"],
            &[
                ("m1", "ash", "birch", "final", Some((2, 1))),
                ("m2", "birch", "ash", "final", Some((0, 0))),
                ("m3", "ash", "birch", "live", Some((1, 2))),
                ("m4", "ash", "birch", "postponed", None),
                ("m5", "ash", "birch", "abandoned", Some((1, 0))),
                ("m6", "ash", "birch", "suspended", Some((0, 0))),
            ],
            "",
        )
        .unwrap();
        let (o, f) = run_on(&d, ("contest", EntityRef::Contest(0)));
        assert_eq!(o, "won");
        assert_eq!(f["score"].render(Style::Text), "Ash FC 2\u{2013}1 Birch FC");
        assert_eq!(f["score"].render(Style::Spoken), "Ash FC two, Birch FC one");
        assert_eq!(f["winner"].render(Style::Text), "Ash FC");
        assert_eq!(run_on(&d, ("contest", EntityRef::Contest(1))).0, "drawn");
        // Level, with places given: decided another way.
        let mut level = d.clone();
        level.contests[1].entries[1].place = Some(2);
        assert_eq!(
            run_on(&level, ("contest", EntityRef::Contest(1))).0,
            "won_level"
        );
        let (o, f) = run_on(&d, ("contest", EntityRef::Contest(2)));
        assert_eq!(o, "live");
        assert_eq!(f["leader"].render(Style::Text), "Birch FC");
        assert_eq!(
            run_on(&d, ("contest", EntityRef::Contest(3))).0,
            "postponed"
        );
        assert_eq!(
            run_on(&d, ("contest", EntityRef::Contest(4))).0,
            "abandoned"
        );
        assert_eq!(
            run_on(&d, ("contest", EntityRef::Contest(5))).0,
            "suspended"
        );
    }

    #[test]
    fn a_team_means_its_match_under_way_else_its_latest() {
        let d = league(
            &["ash", "birch", "cedar"],
            &[
                ("m1", "ash", "birch", "final", Some((2, 1))),
                ("m2", "cedar", "ash", "live", Some((0, 0))),
            ],
            "",
        )
        .unwrap();
        let ash = EntityRef::Group(d.group("ash").unwrap());
        let (o, f) = run_on(&d, ("group", ash));
        assert_eq!(o, "live");
        assert_eq!(f["level"], Value::Int(1));
        let birch = EntityRef::Group(d.group("birch").unwrap());
        let (o, f) = run_on(&d, ("group", birch));
        assert_eq!(o, "won");
        assert_eq!(f["match"].render(Style::Text), "Ash FC v Birch FC");
    }
}
