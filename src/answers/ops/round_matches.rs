//! `round_matches`: every contest of one round ("matchday 5", "the
//! semi-finals"): results of those played, the score of those under way,
//! when the rest are due, and which are off.

use super::support::when_value;
use super::team_support::score_value;
use super::*;
use crate::answers::value::Style;
use crate::dataset::Status;

pub static SPEC: OpSpec = OpSpec {
    name: "round_matches",
    summary: "the matches of a round, with results and kick-off times",
    params: &[Param {
        name: "round",
        kind: EntityKind::Round,
        required: true,
    }],
    outcomes: &[
        answered(
            "answered",
            &["round", "items", "count", "played", "to_play", "off"],
        ),
        no_data("none", &["round"]),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let Some(SlotValue::Round { value: round }) = input.slots.get("round") else {
        return OpOutput::Choose {
            slot: "round",
            options: vec![],
        };
    };
    let mut f = Facts::new().set("round", Value::Text(round.clone()));
    let mut ours: Vec<usize> = (0..data.contests.len())
        .filter(|&ci| {
            let c = &data.contests[ci];
            c.round.as_deref() == Some(round.as_str()) || c.phase == *round
        })
        .collect();
    if ours.is_empty() {
        return OpOutput::done("none", f, vec![]);
    }
    ours.sort_by_key(|&ci| data.facts[ci].start.timestamp());
    let mut items = Vec::new();
    let (mut played, mut to_play, mut off) = (0, 0, 0);
    for &ci in &ours {
        let c = &data.contests[ci];
        let what = match data.score_line(ci) {
            Some(line) => score_value(data, ci, &line),
            None => Value::Text(data.contest_name(ci)),
        };
        // The status word for contests not simply played or to come, as
        // the data name it.
        let item = match c.status {
            Status::Final => {
                played += 1;
                what
            }
            Status::Scheduled => {
                to_play += 1;
                let name = data.contest_name(ci);
                let when = when_value(&data.facts[ci].start, input.now);
                Value::Dual {
                    text: format!("{name} ({})", when.render(Style::Text)),
                    spoken: format!("{name}, {}", when.render(Style::Spoken)),
                }
            }
            s => {
                // Suspended play may resume: still to finish, not off.
                if matches!(s, Status::Postponed | Status::Abandoned) {
                    off += 1;
                } else {
                    to_play += 1;
                }
                let shown = if s == Status::Postponed {
                    Value::Text(data.contest_name(ci))
                } else {
                    what
                };
                Value::Dual {
                    text: format!("{} ({})", shown.render(Style::Text), s.name()),
                    spoken: format!("{}, {}", shown.render(Style::Spoken), s.name()),
                }
            }
        };
        items.push(item);
    }
    f.put("count", Value::Int(ours.len() as i64));
    f.put("played", Value::Int(played));
    f.put("to_play", Value::Int(to_play));
    f.put("off", Value::Int(off));
    f.put("items", Value::List(items));
    let mentioned = ours.iter().map(|&ci| EntityRef::Contest(ci)).collect();
    OpOutput::done("answered", f, mentioned)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::answers::ops::testing::run_with;
    use crate::dataset::sides::testing::league;

    #[test]
    fn a_round_lists_results_live_scores_and_what_is_off() {
        let mut d = league(
            &["ash", "birch", "cedar", "dale"],
            &[
                ("m1", "ash", "birch", "final", Some((2, 1))),
                ("m2", "cedar", "dale", "postponed", None),
                ("m3", "birch", "cedar", "final", Some((0, 0))),
            ],
            "",
        )
        .unwrap();
        // The test league gives each match its own matchday: put the
        // first two in one round.
        d.contests[1].round = Some("matchday 1".into());
        let mut slots = Slots::new();
        slots.insert(
            "round".into(),
            SlotValue::Round {
                value: "matchday 1".into(),
            },
        );
        match run_with(run, &d, &slots) {
            OpOutput::Done { outcome, facts, .. } => {
                assert_eq!(outcome, "answered");
                assert_eq!(
                    facts["items"].render(Style::Text),
                    "Ash FC 2\u{2013}1 Birch FC and Cedar FC v Dale FC (postponed)"
                );
                assert_eq!(facts["played"], Value::Int(1));
                assert_eq!(facts["off"], Value::Int(1));
            }
            other => panic!("{other:?}"),
        }
        slots.insert(
            "round".into(),
            SlotValue::Round {
                value: "matchday 9".into(),
            },
        );
        assert!(matches!(
            run_with(run, &d, &slots),
            OpOutput::Done {
                outcome: "none",
                ..
            }
        ));
    }
}
