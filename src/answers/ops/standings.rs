//! `standings`: the full order of one contest, place by place, with each
//! mark (and, for a vote count, each share of the votes counted) — the
//! results table for an event or for one ward on an election night.

use super::support::{
    entry_value, mark_value, percent_value, placed, staleness, status_phrase, updated_value,
    vote_facts, vote_shares, when_value,
};
use super::*;
use crate::answers::value::Style;
use crate::answers::words;
use crate::dataset::{EntryStatus, Status};

pub static SPEC: OpSpec = OpSpec {
    name: "standings",
    summary: "the full results or current standings of a contest",
    params: &[
        Param {
            name: "contest",
            kind: EntityKind::Contest,
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
            "final",
            &[
                "contest_name",
                "rows",
                "shown",
                "placed",
                "more",
                "out",
                "counted",
            ],
        ),
        // Standings while the contest is under way are an answer too.
        answered(
            "live",
            &[
                "contest_name",
                "rows",
                "shown",
                "placed",
                "more",
                "out",
                "counted",
                "updated",
                "stale",
            ],
        ),
        no_data("scheduled", &["contest_name", "start", "entrants"]),
        no_data("no_result", &["contest_name"]),
    ],
    run,
};

/// How many places to list when neither the reader nor the intent's
/// `settings.rows` says.
const DEFAULT_ROWS: usize = 10;

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let Some(ci) = input.contest("contest") else {
        return OpOutput::done("no_result", Facts::new(), vec![]);
    };
    let c = &data.contests[ci];
    let me = EntityRef::Contest(ci);
    let mut f = Facts::new().set("contest_name", data.contest_name(ci));
    if c.status == Status::Scheduled {
        f.put("start", when_value(&data.facts[ci].start, input.now));
        // Who is entered (a start list; the candidates standing), in the
        // order the data give them.
        let entrants: Vec<Value> = c.entries.iter().map(|e| entry_value(data, e)).collect();
        let mut mentioned = vec![me];
        mentioned.extend(
            c.entries
                .iter()
                .filter_map(|e| super::support::entry_entity(data, e)),
        );
        f.put("entrants", Value::List(entrants));
        return OpOutput::done("scheduled", f, mentioned);
    }
    let order = placed(c);
    if order.is_empty() || super::support::no_votes_yet(data, ci) {
        return OpOutput::done("no_result", f, vec![me]);
    }
    let n = input.rows(DEFAULT_ROWS);
    // Like the medal table, a cut never splits a shared place.
    let cutoff = c.entries[order[n.min(order.len()) - 1]].place;
    let shown: Vec<usize> = order
        .iter()
        .copied()
        .filter(|&i| c.entries[i].place <= cutoff)
        .collect();
    let shares = vote_shares(data, ci);
    let rows: Vec<Value> = shown
        .iter()
        .map(|&i| {
            let e = &c.entries[i];
            let place = e.place.unwrap_or_default() as u64;
            let who = entry_value(data, e);
            let mark = mark_value(data, ci, i);
            let share = shares.as_ref().and_then(|s| s[i]).map(percent_value);
            // Written "1. Name (Party) 698 votes (45.1%)"; spoken "first,
            // Name of Party, six hundred and ninety-eight votes, forty-five
            // point one per cent" (brackets are not heard).
            let mut text = format!("{place}. {}", who.render(Style::Text));
            let mut spoken = format!("{}, {}", words::ordinal(place), who.render(Style::Spoken));
            if let Some(m) = &mark {
                text.push_str(&format!(" {}", m.render(Style::Text)));
                spoken.push_str(&format!(", {}", m.render(Style::Spoken)));
            }
            if let Some(s) = &share {
                text.push_str(&format!(" ({})", s.render(Style::Text)));
                spoken.push_str(&format!(", {}", s.render(Style::Spoken)));
            }
            Value::Dual { text, spoken }
        })
        .collect();
    // Those who did not finish, start or stand, so the table is complete.
    let out: Vec<Value> = c
        .entries
        .iter()
        .filter(|e| e.status != EntryStatus::Ok)
        .map(|e| {
            let who = entry_value(data, e);
            let why = status_phrase(e.status);
            Value::Dual {
                text: format!("{} {why}", who.render(Style::Text)),
                spoken: format!("{} {why}", who.render(Style::Spoken)),
            }
        })
        .collect();
    f.put("shown", Value::Int(rows.len() as i64));
    f.put("placed", Value::Int(order.len() as i64));
    // A cut list must say it is cut, or "full results" reads as complete.
    if order.len() > rows.len() {
        f.put("more", Value::Int((order.len() - rows.len()) as i64));
    }
    f.put("rows", Value::List(rows));
    f.put("out", Value::List(out));
    vote_facts(data, ci, None, &mut f);
    let mut mentioned = vec![me];
    mentioned.extend(
        shown
            .iter()
            .filter_map(|&i| super::support::entry_entity(data, &c.entries[i])),
    );
    let firsts: Vec<EntityRef> = shown
        .iter()
        .filter(|&&i| c.entries[i].place == c.entries[order[0]].place)
        .filter_map(|&i| super::support::entry_entity(data, &c.entries[i]))
        .collect();
    if c.status == Status::Live {
        if let Some(t) = updated_value(data, ci) {
            f.put("updated", t);
        }
        if let Some(s) = staleness(data, ci, input.now, input.stale_after) {
            f.put("stale", s);
        }
        return OpOutput::done("live", f, mentioned).about(firsts);
    }
    OpOutput::done("final", f, mentioned).about(firsts)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::answers::ops::testing::{entity, run_with};
    use crate::answers::value::Style;
    use crate::dataset::demo;
    use crate::dataset::Dataset;

    fn run_on(data: &Dataset, contest: &str, count: Option<u32>) -> OpOutput {
        let ci = data.contests.iter().position(|c| c.id == contest).unwrap();
        let mut slots = Slots::new();
        slots.insert("contest".into(), entity(EntityRef::Contest(ci)));
        if let Some(n) = count {
            slots.insert("count".into(), SlotValue::Count { value: n });
        }
        run_with(run, data, &slots)
    }

    fn text(out: &OpOutput, fact: &str) -> (String, String) {
        match out {
            OpOutput::Done { facts, .. } => {
                let v = &facts[fact];
                (v.render(Style::Text), v.render(Style::Spoken))
            }
            other => panic!("expected facts, got {other:?}"),
        }
    }

    fn outcome(out: &OpOutput) -> &str {
        match out {
            OpOutput::Done { outcome, .. } => outcome,
            other => panic!("expected an outcome, got {other:?}"),
        }
    }

    #[test]
    fn a_final_lists_every_place_and_who_did_not_finish() {
        let d = demo();
        let out = run_on(&d, "ath-w-400m-final", None);
        assert_eq!(outcome(&out), "final");
        let (rows, spoken) = text(&out, "rows");
        assert!(
            rows.starts_with("1. Rasaline Rentenert (Halvorne) 49.96 s, 2. "),
            "{rows}"
        );
        assert!(
            rows.ends_with("7. Deline Stesseroy (Sordavia) 50.88 s"),
            "{rows}"
        );
        assert!(
            spoken.starts_with(
                "first, Rasaline Rentenert of Halvorne, forty-nine point nine six seconds"
            ),
            "{spoken}"
        );
        assert_eq!(
            text(&out, "out").0,
            "Drada Brorrorn (Tolmerin) was disqualified"
        );
        assert_eq!(text(&out, "placed").0, "seven");
    }

    #[test]
    fn a_count_from_the_reader_limits_the_rows() {
        let d = demo();
        let out = run_on(&d, "ath-w-long-jump-final", Some(2));
        let (rows, _) = text(&out, "rows");
        assert_eq!(
            rows,
            "1. Sondora Hervoveth (Sordavia) 6.95 m and 2. Tuthette Brossayne (Halvorne) 6.92 m"
        );
        // A cut list says how many it leaves out; a whole one does not.
        let has_more = |o: &OpOutput| match o {
            OpOutput::Done { facts, .. } => facts.contains_key("more"),
            other => panic!("expected facts, got {other:?}"),
        };
        assert!(has_more(&out));
        let int = |o: &OpOutput, k: &str| match o {
            OpOutput::Done { facts, .. } => match &facts[k] {
                Value::Int(n) => *n,
                v => panic!("{k}: {v:?}"),
            },
            other => panic!("expected facts, got {other:?}"),
        };
        assert_eq!(int(&out, "more"), int(&out, "placed") - 2);
        let whole = run_on(&d, "ath-w-long-jump-final", Some(99));
        assert!(!has_more(&whole));
    }

    #[test]
    fn live_and_scheduled_contests() {
        let d = demo();
        let live = run_on(&d, "ath-m-marathon-final", None);
        assert_eq!(outcome(&live), "live");
        assert!(text(&live, "rows")
            .0
            .starts_with("1. Banel Morressi (Kalvenmark) 1:59:32"));
        let sched = d
            .contests
            .iter()
            .find(|c| c.status == Status::Scheduled)
            .unwrap()
            .id
            .clone();
        let out = run_on(&d, &sched, None);
        assert_eq!(outcome(&out), "scheduled");
        // The start list: everyone entered, none of them placed.
        let ci = d.contests.iter().position(|c| c.id == sched).unwrap();
        match &out {
            OpOutput::Done { facts, .. } => {
                assert_eq!(
                    facts["entrants"].count(),
                    d.contests[ci].entries.len() as i64
                );
            }
            other => panic!("{other:?}"),
        }
    }
}
