//! `team_form`: a team's recent results, latest last ("W D L W W"), and
//! how many of them it won, drew and lost.

use super::team_support::{opponent, pair_value, result_verb, results_of};
use super::*;
use crate::answers::value::Style;
use crate::dataset::sides::Outcome;

pub static SPEC: OpSpec = OpSpec {
    name: "team_form",
    summary: "a team's form: its last results",
    params: &[
        Param {
            name: "group",
            kind: EntityKind::Group,
            required: true,
        },
        Param {
            name: "count",
            kind: EntityKind::Count,
            required: false,
        },
    ],
    outcomes: &[
        answered(
            "answered",
            &["name", "form", "games", "won", "drawn", "lost", "results"],
        ),
        no_data("none", &["name"]),
    ],
    run,
};

/// Form is the last five results unless the reader or `settings.rows`
/// says otherwise (common practice in league tables).
const DEFAULT_GAMES: usize = 5;

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let Some(EntityRef::Group(g)) = input.entity("group") else {
        return OpOutput::Choose {
            slot: "group",
            options: vec![],
        };
    };
    let f = Facts::new().set("name", data.group_name_value(g));
    let n = input.rows(DEFAULT_GAMES);
    let mut last: Vec<(usize, usize, Outcome)> = results_of(data, g, input.now)
        .into_iter()
        .filter_map(|(ci, ei)| data.outcome_for(ci, ei).map(|o| (ci, ei, o)))
        .take(n)
        .collect();
    if last.is_empty() {
        return OpOutput::done("none", f, vec![EntityRef::Group(g)]);
    }
    // Oldest first, as form guides read left to right.
    last.reverse();
    let letters: Vec<String> = last
        .iter()
        .map(|(_, _, o)| o.letter().to_string())
        .collect();
    let spoken: Vec<&str> = last.iter().map(|(_, _, o)| result_word(*o)).collect();
    let count = |o: Outcome| last.iter().filter(|(_, _, x)| *x == o).count() as i64;
    let results: Vec<Value> = last
        .iter()
        .map(|&(ci, ei, o)| {
            let line = data.score_line(ci).expect("a result has a score line");
            let (h, a) = line.scores().expect("a result has both scores");
            let (mine, theirs) = if ei == line.home { (h, a) } else { (a, h) };
            let score = pair_value(data, mine, theirs, false);
            let other = opponent(data, ci, ei).map(|(_, n)| n).unwrap_or_default();
            let prep = if o == Outcome::Drawn {
                "with"
            } else {
                "against"
            };
            Value::Dual {
                text: format!(
                    "{} {} {prep} {other}",
                    result_verb(o),
                    score.render(Style::Text)
                ),
                spoken: format!(
                    "{} {} {prep} {other}",
                    result_verb(o),
                    score.render(Style::Spoken)
                ),
            }
        })
        .collect();
    let f = f
        .set(
            "form",
            Value::Dual {
                text: letters.join(" "),
                spoken: spoken.join(", "),
            },
        )
        .set("games", Value::Int(last.len() as i64))
        .set("won", Value::Int(count(Outcome::Won)))
        .set("drawn", Value::Int(count(Outcome::Drawn)))
        .set("lost", Value::Int(count(Outcome::Lost)))
        .set("results", Value::List(results));
    OpOutput::done("answered", f, vec![EntityRef::Group(g)])
}

/// A result letter as said aloud.
fn result_word(o: Outcome) -> &'static str {
    match o {
        Outcome::Won => "win",
        Outcome::Drawn => "draw",
        Outcome::Lost => "defeat",
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::answers::ops::testing::{entity, run_with};
    use crate::dataset::sides::testing::league;

    #[test]
    fn form_is_the_last_five_oldest_first() {
        let d = league(
            &["ash", "birch"],
            &[
                ("m1", "ash", "birch", "final", Some((0, 1))),
                ("m2", "birch", "ash", "final", Some((1, 1))),
                ("m3", "ash", "birch", "final", Some((2, 0))),
                ("m4", "birch", "ash", "final", Some((3, 0))),
                ("m5", "ash", "birch", "final", Some((1, 0))),
                ("m6", "birch", "ash", "final", Some((0, 2))),
                ("m7", "ash", "birch", "scheduled", None),
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
                assert_eq!(facts["form"].render(Style::Text), "D W L W W");
                assert_eq!(
                    facts["form"].render(Style::Spoken),
                    "draw, win, defeat, win, win"
                );
                assert_eq!(facts["won"], Value::Int(3));
                assert_eq!(facts["games"], Value::Int(5));
            }
            other => panic!("{other:?}"),
        }
        slots.insert("count".into(), SlotValue::Count { value: 2 });
        match run_with(run, &d, &slots) {
            OpOutput::Done { facts, .. } => {
                assert_eq!(facts["form"].render(Style::Text), "W W")
            }
            other => panic!("{other:?}"),
        }
    }
}
