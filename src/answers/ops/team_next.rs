//! `team_next`: a team's next match: who against, home or away, when and
//! where; or the match it is playing now.

use super::support::when_value;
use super::team_support::{matches_of, opponent, venue_word};
use super::*;
use crate::dataset::Status;

pub static SPEC: OpSpec = OpSpec {
    name: "team_next",
    summary: "a team's next match",
    params: &[Param {
        name: "group",
        kind: EntityKind::Group,
        required: true,
    }],
    outcomes: &[
        answered(
            "upcoming",
            &[
                "name",
                "opponent",
                "where",
                "start",
                "venue",
                "round",
                "postponed",
            ],
        ),
        answered("playing", &["name", "opponent", "where", "round"]),
        no_data("none", &["name", "postponed"]),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let Some(EntityRef::Group(g)) = input.entity("group") else {
        return OpOutput::Choose {
            slot: "group",
            options: vec![],
        };
    };
    let mut f = Facts::new().set("name", data.group_name_value(g));
    let all = matches_of(data, g);
    let now = input.now.timestamp();
    // Matches put off with no new date, so "next" does not hide them.
    let postponed: Vec<Value> = all
        .iter()
        .filter(|(ci, _)| data.contests[*ci].status == Status::Postponed)
        .filter_map(|&(ci, ei)| opponent(data, ci, ei).map(|(_, n)| Value::Text(n)))
        .collect();
    if !postponed.is_empty() {
        f.put("postponed", Value::List(postponed));
    }
    let mut mentioned = vec![EntityRef::Group(g)];
    let put_match = |f: &mut Facts, ci: usize, ei: usize, mentioned: &mut Vec<EntityRef>| {
        let c = &data.contests[ci];
        if let Some((og, on)) = opponent(data, ci, ei) {
            f.put("opponent", Value::Text(on));
            mentioned.push(EntityRef::Group(og));
        }
        f.put("where", Value::Text(venue_word(c.entries[ei].side).into()));
        if let Some(r) = &c.round {
            f.put("round", Value::Text(r.clone()));
        }
        mentioned.push(EntityRef::Contest(ci));
    };
    if let Some(&(ci, ei)) = all
        .iter()
        .find(|(ci, _)| matches!(data.contests[*ci].status, Status::Live | Status::Suspended))
    {
        put_match(&mut f, ci, ei, &mut mentioned);
        return OpOutput::done("playing", f, mentioned);
    }
    let next = all.iter().find(|(ci, _)| {
        data.contests[*ci].status == Status::Scheduled && data.facts[*ci].start.timestamp() >= now
    });
    let Some(&(ci, ei)) = next else {
        return OpOutput::done("none", f, mentioned);
    };
    put_match(&mut f, ci, ei, &mut mentioned);
    f.put("start", when_value(&data.facts[ci].start, input.now));
    if let Some(v) = &data.contests[ci].venue {
        f.put("venue", Value::Text(v.clone()));
    }
    OpOutput::done("upcoming", f, mentioned)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::answers::ops::testing::{entity, run_with};
    use crate::answers::value::Style;
    use crate::dataset::sides::testing::league;

    #[test]
    fn the_next_scheduled_match_and_any_postponed_one() {
        // Matches fall on 1, 2 and 3 March; it is 2 March.
        let mut d = league(
            &["ash", "birch", "cedar"],
            &[
                ("m1", "ash", "birch", "final", Some((2, 1))),
                ("m2", "cedar", "ash", "postponed", None),
                ("m3", "birch", "ash", "scheduled", None),
            ],
            "",
        )
        .unwrap();
        d.clock = Some("2027-03-02T00:00:00Z".parse().unwrap());
        let mut slots = Slots::new();
        slots.insert(
            "group".into(),
            entity(EntityRef::Group(d.group("ash").unwrap())),
        );
        match run_with(run, &d, &slots) {
            OpOutput::Done { outcome, facts, .. } => {
                assert_eq!(outcome, "upcoming");
                assert_eq!(facts["opponent"].render(Style::Text), "Birch FC");
                assert_eq!(facts["where"].render(Style::Text), "away");
                assert_eq!(facts["postponed"].render(Style::Text), "Cedar FC");
            }
            other => panic!("{other:?}"),
        }
    }
}
