//! `team_last`: a team's last result, from its side: "won 3–1 at home to
//! Lanner Vale".

use super::support::when_value;
use super::team_support::{opponent, pair_value, result_verb, results_of, venue_word};
use super::*;

pub static SPEC: OpSpec = OpSpec {
    name: "team_last",
    summary: "a team's last result",
    params: &[Param {
        name: "group",
        kind: EntityKind::Group,
        required: true,
    }],
    outcomes: &[
        answered(
            "answered",
            &[
                "name", "result", "score", "opponent", "where", "start", "round",
            ],
        ),
        no_data("none", &["name"]),
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
    let mut mentioned = vec![EntityRef::Group(g)];
    let last = results_of(data, g, input.now)
        .into_iter()
        .find_map(|(ci, ei)| data.outcome_for(ci, ei).map(|o| (ci, ei, o)));
    let Some((ci, ei, outcome)) = last else {
        return OpOutput::done("none", f, mentioned);
    };
    let c = &data.contests[ci];
    let line = data.score_line(ci).expect("a result has a score line");
    let (h, a) = line.scores().expect("a result has both scores");
    let (mine, theirs) = if ei == line.home { (h, a) } else { (a, h) };
    f.put("result", Value::Text(result_verb(outcome).into()));
    f.put("score", pair_value(data, mine, theirs, false));
    if let Some((og, on)) = opponent(data, ci, ei) {
        f.put("opponent", Value::Text(on));
        mentioned.push(EntityRef::Group(og));
    }
    f.put("where", Value::Text(venue_word(c.entries[ei].side).into()));
    f.put("start", when_value(&data.facts[ci].start, input.now));
    if let Some(r) = &c.round {
        f.put("round", Value::Text(r.clone()));
    }
    mentioned.push(EntityRef::Contest(ci));
    OpOutput::done("answered", f, mentioned)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::answers::ops::testing::{entity, run_with};
    use crate::answers::value::Style;
    use crate::dataset::sides::testing::league;

    #[test]
    fn the_last_result_reads_from_the_teams_side() {
        let d = league(
            &["ash", "birch", "cedar"],
            &[
                ("m1", "ash", "birch", "final", Some((2, 1))),
                ("m2", "cedar", "ash", "final", Some((3, 0))),
                ("m3", "ash", "cedar", "live", Some((1, 0))),
            ],
            "",
        )
        .unwrap();
        let mut slots = Slots::new();
        slots.insert(
            "group".into(),
            entity(EntityRef::Group(d.group("ash").unwrap())),
        );
        match run_with(run, &d, &slots) {
            OpOutput::Done { outcome, facts, .. } => {
                assert_eq!(outcome, "answered");
                assert_eq!(facts["result"].render(Style::Text), "lost");
                assert_eq!(facts["score"].render(Style::Text), "3\u{2013}0");
                assert_eq!(facts["score"].render(Style::Spoken), "three-nil");
                assert_eq!(facts["opponent"].render(Style::Text), "Cedar FC");
                assert_eq!(facts["where"].render(Style::Text), "away");
            }
            other => panic!("{other:?}"),
        }
        let d = league(
            &["ash", "birch"],
            &[("m1", "ash", "birch", "scheduled", None)],
            "",
        )
        .unwrap();
        let mut slots = Slots::new();
        slots.insert("group".into(), entity(EntityRef::Group(0)));
        assert!(matches!(
            run_with(run, &d, &slots),
            OpOutput::Done {
                outcome: "none",
                ..
            }
        ));
    }
}
