//! `profile`: a competitor's results and awards across the whole scenario,
//! and their next contest.

use super::support::{mark_value, medal_facts, status_phrase, when_value};
use super::*;
use crate::dataset::{EntryStatus, Status};

pub static SPEC: OpSpec = OpSpec {
    name: "profile",
    summary: "a competitor's results and medals so far",
    params: &[
        Param {
            name: "competitor",
            kind: EntityKind::Competitor,
            required: true,
        },
        // One award only: "how many golds has she won?"
        Param {
            name: "award",
            kind: EntityKind::Award,
            required: false,
        },
    ],
    outcomes: &[
        answered(
            "answered",
            &[
                "name",
                "group",
                "sport_noun",
                "results",
                "results_count",
                "gold",
                "silver",
                "bronze",
                "total",
                "breakdown",
                "next",
            ],
        ),
        answered(
            "no_medals",
            &[
                "name",
                "group",
                "sport_noun",
                "results",
                "results_count",
                "next",
            ],
        ),
        answered("award", &["name", "award", "award_count"]),
        no_data(
            "nothing_yet",
            &["name", "group", "sport_noun", "live", "next"],
        ),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let Some(pi) = input.competitor("competitor") else {
        return OpOutput::done("nothing_yet", Facts::new(), vec![]);
    };
    let who = &data.competitors[pi];
    let mut f = Facts::new().set("name", who.name());
    if let Some(g) = data.group(&who.group) {
        f.put("group", data.groups[g].name.as_str());
    }
    if let Some(s) = data.sport(&who.sport) {
        f.put("sport_noun", data.sports[s].noun.as_str());
    }
    let mut results = Vec::new();
    let mut counts = vec![0u32; data.awards().len()];
    let mut next: Option<usize> = None;
    let mut theirs = data.contests_of(pi).to_vec();
    theirs.sort_by_key(|(c, _)| data.facts[*c].start.timestamp());
    for (ci, ei) in theirs {
        let c = &data.contests[ci];
        let e = &c.entries[ei];
        match c.status {
            Status::Scheduled => {
                if next.is_none() {
                    next = Some(ci);
                }
            }
            // Put off or abandoned: neither next nor a result.
            Status::Postponed | Status::Abandoned => {}
            Status::Live | Status::Suspended => {
                if !f.0.contains_key("live") {
                    f.put("live", format!("the {}", data.contest_name(ci)));
                }
            }
            Status::Final => {
                let name = data.contest_name(ci);
                let value = if e.status != EntryStatus::Ok {
                    Value::Text(format!("{} in the {name}", status_phrase(e.status)))
                } else if let Some(p) = e.place {
                    let placed = Value::ordinal(p as u64).then(" in the ", &Value::Text(name));
                    // The mark is what a reader asking "how has she done"
                    // wants next to the place: 3rd with 6.71 m.
                    match mark_value(data, ci, ei) {
                        Some(m) => placed.then(" with ", &m),
                        None => placed,
                    }
                } else {
                    continue;
                };
                results.push(value);
                if let Some(k) = e
                    .award
                    .as_ref()
                    .and_then(|a| data.awards().iter().position(|x| x == a))
                {
                    counts[k] += 1;
                }
            }
        }
    }
    if let Some(ci) = next {
        let start = when_value(&data.facts[ci].start, input.now);
        let name = data.contest_name(ci);
        f.put(
            "next",
            Value::Dual {
                text: format!(
                    "the {name} {}",
                    start.render(crate::answers::value::Style::Text)
                ),
                spoken: format!(
                    "the {name} {}",
                    start.render(crate::answers::value::Style::Spoken)
                ),
            },
        );
    }
    let mentioned = vec![EntityRef::Competitor(pi)];
    if let Some(award) = input.text("award") {
        let n = data
            .awards()
            .iter()
            .position(|a| a == award)
            .map_or(0, |k| counts[k]);
        f.put("award", award);
        f.put("award_count", super::support::award_count(award, n));
        return OpOutput::done("award", f, mentioned);
    }
    if results.is_empty() {
        return OpOutput::done("nothing_yet", f, mentioned);
    }
    f.put("results_count", Value::Int(results.len() as i64));
    f.put("results", Value::List(results));
    if counts.iter().all(|&n| n == 0) {
        return OpOutput::done("no_medals", f, mentioned);
    }
    medal_facts(data, &counts, &mut f);
    OpOutput::done("answered", f, mentioned)
}
