//! `team_record`: the head-to-head record between two teams in the
//! matches the data hold: meetings, wins each, draws, goals each, and the
//! last meeting.

use super::support::when_value;
use super::team_support::{matches_of, score_value};
use super::*;
use crate::dataset::sides::Outcome;
use crate::dataset::Status;

pub static SPEC: OpSpec = OpSpec {
    name: "team_record",
    summary: "the head-to-head record between two teams",
    params: &[
        Param {
            name: "group",
            kind: EntityKind::Group,
            required: true,
        },
        Param {
            name: "rival",
            kind: EntityKind::Group,
            required: true,
        },
    ],
    outcomes: &[
        answered(
            "answered",
            &[
                "name",
                "rival",
                "played",
                "wins",
                "rival_wins",
                "draws",
                "scored",
                "rival_scored",
                "last",
                "last_when",
                "next",
            ],
        ),
        no_data("never_met", &["name", "rival", "next"]),
        no_data("same_team", &["name"]),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let (Some(EntityRef::Group(a)), Some(EntityRef::Group(b))) =
        (input.entity("group"), input.entity("rival"))
    else {
        let slot = if input.entity("group").is_none() {
            "group"
        } else {
            "rival"
        };
        return OpOutput::Choose {
            slot,
            options: vec![],
        };
    };
    let mut f = Facts::new().set("name", data.group_name_value(a));
    if a == b {
        return OpOutput::done("same_team", f, vec![EntityRef::Group(a)]);
    }
    f.put("rival", data.group_name_value(b));
    let mentioned = vec![EntityRef::Group(a), EntityRef::Group(b)];
    let meetings: Vec<(usize, usize)> = matches_of(data, a)
        .into_iter()
        .filter(|&(ci, _)| data.entry_of_group(ci, b).is_some())
        .collect();
    let now = input.now.timestamp();
    if let Some(&(ci, _)) = meetings.iter().find(|(ci, _)| {
        data.contests[*ci].status == Status::Scheduled && data.facts[*ci].start.timestamp() >= now
    }) {
        f.put("next", when_value(&data.facts[ci].start, input.now));
    }
    let played: Vec<(usize, usize, Outcome)> = meetings
        .iter()
        .filter_map(|&(ci, ei)| data.outcome_for(ci, ei).map(|o| (ci, ei, o)))
        .collect();
    if played.is_empty() {
        return OpOutput::done("never_met", f, mentioned);
    }
    let count = |o: Outcome| played.iter().filter(|(_, _, x)| *x == o).count() as i64;
    let (mut scored, mut conceded) = (0u64, 0u64);
    for &(ci, ei, _) in &played {
        let line = data.score_line(ci).expect("a result has a score line");
        let (h, aw) = line.scores().expect("a result has both scores");
        let (m, t) = if ei == line.home { (h, aw) } else { (aw, h) };
        scored += m;
        conceded += t;
    }
    let &(lci, _, _) = played.last().expect("not empty");
    let line = data.score_line(lci).expect("a result has a score line");
    f.put("played", Value::Int(played.len() as i64));
    f.put("wins", Value::Int(count(Outcome::Won)));
    f.put("rival_wins", Value::Int(count(Outcome::Lost)));
    f.put("draws", Value::Int(count(Outcome::Drawn)));
    f.put("scored", Value::Int(scored as i64));
    f.put("rival_scored", Value::Int(conceded as i64));
    f.put("last", score_value(data, lci, &line));
    f.put("last_when", when_value(&data.facts[lci].start, input.now));
    OpOutput::done("answered", f, mentioned)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::answers::ops::testing::{entity, run_with};
    use crate::answers::value::Style;
    use crate::dataset::sides::testing::league;

    fn run_on(d: &Dataset, a: &str, b: &str) -> (String, HashMap<String, Value>) {
        let mut slots = Slots::new();
        slots.insert(
            "group".into(),
            entity(EntityRef::Group(d.group(a).unwrap())),
        );
        slots.insert(
            "rival".into(),
            entity(EntityRef::Group(d.group(b).unwrap())),
        );
        match run_with(run, d, &slots) {
            OpOutput::Done { outcome, facts, .. } => (outcome.to_string(), facts),
            other => panic!("{other:?}"),
        }
    }

    #[test]
    fn the_record_counts_wins_each_draws_and_goals() {
        let d = league(
            &["ash", "birch", "cedar"],
            &[
                ("m1", "ash", "birch", "final", Some((2, 1))),
                ("m2", "birch", "ash", "final", Some((1, 1))),
                ("m3", "ash", "cedar", "final", Some((5, 0))),
                ("m4", "birch", "ash", "final", Some((3, 0))),
            ],
            "",
        )
        .unwrap();
        let (o, f) = run_on(&d, "birch", "ash");
        assert_eq!(o, "answered");
        assert_eq!(f["played"], Value::Int(3));
        assert_eq!(f["wins"], Value::Int(1));
        assert_eq!(f["rival_wins"], Value::Int(1));
        assert_eq!(f["draws"], Value::Int(1));
        assert_eq!(f["scored"], Value::Int(5));
        assert_eq!(f["rival_scored"], Value::Int(3));
        assert_eq!(f["last"].render(Style::Text), "Birch FC 3\u{2013}0 Ash FC");
        assert_eq!(run_on(&d, "birch", "cedar").0, "never_met");
        assert_eq!(run_on(&d, "ash", "ash").0, "same_team");
    }
}
