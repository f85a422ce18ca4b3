//! `result`: how one competitor did in one contest.

use super::support::{mark_value, named_entry, status_phrase, when_value};
use super::*;
use crate::dataset::{EntryStatus, Status};

pub static SPEC: OpSpec = OpSpec {
    name: "result",
    summary: "a competitor's result in a contest",
    params: &[
        Param {
            name: "competitor",
            kind: EntityKind::Competitor,
            required: true,
        },
        Param {
            name: "contest",
            kind: EntityKind::Contest,
            required: false,
        },
    ],
    outcomes: &[
        answered(
            "answered",
            &[
                "name",
                "place",
                "place_nth",
                "mark",
                "award",
                "contest_name",
                "share",
                "counted",
                "winner",
            ],
        ),
        answered("did_not_finish", &["name", "status", "contest_name"]),
        so_far(
            "live",
            &[
                "name",
                "place",
                "place_nth",
                "mark",
                "contest_name",
                "stale",
                "share",
                "counted",
            ],
        ),
        no_data("scheduled", &["name", "start", "contest_name"]),
        no_data("not_entered", &["name", "contest_name"]),
        no_data("no_result", &["name", "contest_name"]),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let Some(pi) = input.competitor("competitor") else {
        return OpOutput::done("no_result", Facts::new(), vec![]);
    };
    let who = EntityRef::Competitor(pi);
    let name = data.competitors[pi].name();
    let theirs = data.contests_of(pi);
    let (ci, ei) = match named_entry(input, pi) {
        Err(not_entered) => return not_entered,
        Ok(Some(pair)) => pair,
        Ok(None) => match theirs {
            [] => return OpOutput::done("no_result", Facts::new().set("name", name), vec![who]),
            [only] => *only,
            // Several contests: ask which, never pick one silently.
            many => {
                return OpOutput::Choose {
                    slot: "contest",
                    options: many.iter().map(|(c, _)| EntityRef::Contest(*c)).collect(),
                }
            }
        },
    };
    let c = &data.contests[ci];
    let e = &c.entries[ei];
    let mentioned = vec![who, EntityRef::Contest(ci)];
    let mut f = Facts::new()
        .set("name", name)
        .set("contest_name", data.contest_name(ci));
    if c.status == Status::Scheduled {
        f.put("start", when_value(&data.facts[ci].start, input.now));
        return OpOutput::done("scheduled", f, mentioned);
    }
    if e.status != EntryStatus::Ok {
        f.put("status", status_phrase(e.status));
        return OpOutput::done("did_not_finish", f, mentioned);
    }
    let place = e.place.filter(|_| !super::support::no_votes_yet(data, ci));
    let Some(place) = place else {
        return OpOutput::done(
            if c.status == Status::Live {
                "live"
            } else {
                "no_result"
            },
            f,
            mentioned,
        );
    };
    f.put("place", Value::Int(place as i64));
    // A place shared with someone else reads "joint 2nd".
    let shared = c
        .entries
        .iter()
        .enumerate()
        .any(|(i, o)| i != ei && o.place == Some(place));
    f.put("place_nth", super::support::rank_value(place, shared));
    if let Some(m) = mark_value(data, ci, ei) {
        f.put("mark", m);
    }
    super::support::vote_facts(data, ci, Some(ei), &mut f);
    if c.status == Status::Live {
        if let Some(s) = super::support::staleness(data, ci, input.now, input.stale_after) {
            f.put("stale", s);
        }
        return OpOutput::done("live", f, mentioned);
    }
    if let Some(a) = &e.award {
        f.put("award", a.as_str());
    }
    // "Did she win?" answered "she finished 2nd" leaves out who did.
    if place > 1 {
        let first: Vec<usize> = (0..c.entries.len())
            .filter(|&i| c.entries[i].place == Some(1))
            .collect();
        if !first.is_empty() {
            f.put("winner", super::support::labels(data, c, &first));
        }
    }
    OpOutput::done("answered", f, mentioned)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::answers::ops::testing::{entity, run_with};
    use crate::answers::value::Style;
    use crate::dataset::demo;

    fn said(out: &OpOutput, fact: &str) -> Option<String> {
        match out {
            OpOutput::Done { facts, .. } => facts.get(fact).map(|v| v.render(Style::Text)),
            other => panic!("{other:?}"),
        }
    }

    /// Every placed finisher of every final in the demo data: a winner's
    /// result names no other winner; anyone else's names who won, as the
    /// data's first place has it.
    #[test]
    fn a_result_below_first_says_who_won() {
        let d = demo();
        let mut checked = 0;
        for (ci, c) in d.contests.iter().enumerate() {
            if c.status != Status::Final {
                continue;
            }
            for e in &c.entries {
                let (Some(pid), Some(place)) = (e.competitor.as_deref(), e.place) else {
                    continue;
                };
                let pi = d.competitor(pid).unwrap();
                let mut slots = Slots::new();
                slots.insert("competitor".into(), entity(EntityRef::Competitor(pi)));
                slots.insert("contest".into(), entity(EntityRef::Contest(ci)));
                let out = run_with(run, &d, &slots);
                let winner = said(&out, "winner");
                if place == 1 {
                    assert_eq!(winner, None, "{pid} in {}", c.id);
                } else {
                    let first = c.entries.iter().find(|o| o.place == Some(1)).unwrap();
                    let label = super::super::support::entry_label(&d, first);
                    assert_eq!(winner.as_deref(), Some(label.as_str()), "{pid} in {}", c.id);
                    checked += 1;
                }
            }
        }
        assert!(checked > 20, "only {checked} results below first");
    }
}
