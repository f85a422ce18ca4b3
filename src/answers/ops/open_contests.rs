//! `open_contests`: which contests are still open — under way now, or not
//! started — and how many are decided: "what's on right now?" at a games,
//! "which races are still open?" on an election night.

use super::support::{counted_value, when_value};
use super::*;
use crate::answers::value::Style;
use crate::dataset::Status;

pub static SPEC: OpSpec = OpSpec {
    name: "open_contests",
    summary: "which contests are under way or still to come",
    params: &[Param {
        name: "sport",
        kind: EntityKind::Sport,
        required: false,
    }],
    outcomes: &[
        answered(
            "open",
            &[
                "live",
                "live_count",
                "upcoming",
                "upcoming_count",
                "next",
                "upcoming_named",
                "upcoming_many",
                "decided_count",
                "decided_awarding",
                "sport_name",
            ],
        ),
        answered(
            "all_over",
            &["decided_count", "decided_awarding", "sport_name"],
        ),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let sport = match input.entity("sport") {
        Some(EntityRef::Sport(s)) => Some(s),
        _ => None,
    };
    let mut f = Facts::new();
    if let Some(s) = sport {
        f.put("sport_name", data.sports[s].name.as_str());
    }
    let of = |status: Status| -> Vec<usize> {
        let mut v: Vec<usize> = (0..data.contests.len())
            .filter(|&c| data.contests[c].status == status)
            .filter(|&c| sport.is_none_or(|s| data.sport(&data.contests[c].sport) == Some(s)))
            .collect();
        v.sort_by(|&a, &b| {
            data.facts[a]
                .start
                .timestamp()
                .cmp(&data.facts[b].start.timestamp())
                .then_with(|| data.contest_name(a).cmp(&data.contest_name(b)))
        });
        v
    };
    let live = of(Status::Live);
    let upcoming = of(Status::Scheduled);
    let decided = of(Status::Final);
    f.put("decided_count", Value::Int(decided.len() as i64));
    // Of those, the ones that give awards (finals, not heats).
    let awarding = decided.iter().filter(|&&c| data.awards_in(c)).count();
    f.put("decided_awarding", Value::Int(awarding as i64));
    if live.is_empty() && upcoming.is_empty() {
        return OpOutput::done("all_over", f, vec![]);
    }
    let live_items: Vec<Value> = live
        .iter()
        .map(|&c| {
            let name = data.contest_name(c);
            match data.contests[c].counted {
                Some(n) => {
                    let pct = counted_value(n);
                    Value::Dual {
                        text: format!("{name} ({} counted)", pct.render(Style::Text)),
                        spoken: format!("{name}, {} counted", pct.render(Style::Spoken)),
                    }
                }
                None => Value::Text(name),
            }
        })
        .collect();
    let upcoming_items: Vec<Value> = upcoming
        .iter()
        .map(|&c| Value::Text(data.contest_name(c)))
        .collect();
    f.put("live_count", Value::Int(live.len() as i64));
    f.put("live", Value::List(live_items));
    f.put("upcoming_count", Value::Int(upcoming.len() as i64));
    f.put("upcoming", Value::List(upcoming_items));
    if let Some(&c) = upcoming.first() {
        let when = when_value(&data.facts[c].start, input.now);
        f.put("next", Value::Text(data.contest_name(c)).then(" ", &when));
    }
    // A short list is named in full: "two races, starting with A" leaves
    // a reader who asked which races are left without B. A long one is
    // counted, with the next named.
    if upcoming.len() <= NAME_ALL_UP_TO {
        let named: Vec<Value> = upcoming
            .iter()
            .map(|&c| {
                let when = when_value(&data.facts[c].start, input.now);
                Value::Text(data.contest_name(c)).then(" ", &when)
            })
            .collect();
        if !named.is_empty() {
            f.put("upcoming_named", Value::List(named));
        }
    } else {
        f.put("upcoming_many", Value::Int(upcoming.len() as i64));
    }
    let mentioned = live
        .iter()
        .chain(upcoming.iter())
        .map(|&c| EntityRef::Contest(c))
        .collect();
    OpOutput::done("open", f, mentioned)
}

/// Up to this many contests still to start are each named.
const NAME_ALL_UP_TO: usize = 4;

#[cfg(test)]
mod tests {
    use super::*;
    use crate::answers::ops::testing::run_with;
    use crate::dataset::demo;
    use crate::dataset::Dataset;

    fn facts(data: &Dataset, slots: &Slots) -> (&'static str, HashMap<String, Value>) {
        match run_with(run, data, slots) {
            OpOutput::Done { outcome, facts, .. } => (outcome, facts),
            other => panic!("{other:?}"),
        }
    }

    #[test]
    fn lists_what_is_under_way_and_counts_the_rest() {
        let d = demo();
        let (outcome, f) = facts(&d, &Slots::new());
        assert_eq!(outcome, "open");
        let live = f["live"].render(Style::Text);
        for c in d.contests.iter().filter(|c| c.status == Status::Live) {
            let ci = d.contests.iter().position(|x| x.id == c.id).unwrap();
            assert!(live.contains(&d.contest_name(ci)), "{live}");
        }
        let count = |s: Status| d.contests.iter().filter(|c| c.status == s).count() as i64;
        assert_eq!(f["live_count"], Value::Int(count(Status::Live)));
        assert_eq!(f["upcoming_count"], Value::Int(count(Status::Scheduled)));
        assert_eq!(f["decided_count"], Value::Int(count(Status::Final)));
        // The next to start is the scheduled contest with the earliest start.
        assert!(f["next"]
            .render(Style::Text)
            .starts_with("women's 400 m individual medley tomorrow"));
    }

    #[test]
    fn a_few_contests_to_come_are_named_many_are_counted() {
        let d = demo();
        // The demo games have more than four still to come: counted.
        let (_, f) = facts(&d, &Slots::new());
        assert!(!f.contains_key("upcoming_named"));
        assert_eq!(f["upcoming_many"], f["upcoming_count"]);
        // With two left, both are named, each with its start.
        let mut r = crate::dataset::changes::Records::of(&d);
        let mut kept = 0;
        for c in r
            .contests
            .iter_mut()
            .filter(|c| c.status == Status::Scheduled)
        {
            kept += 1;
            if kept > 2 {
                c.status = Status::Final;
                for e in c.entries.iter_mut() {
                    e.place = None;
                    e.mark = None;
                    e.award = None;
                }
            }
        }
        let Ok(d) = r.build(2) else {
            panic!("the records load")
        };
        let (_, f) = facts(&d, &Slots::new());
        assert!(!f.contains_key("upcoming_many"));
        let named = f["upcoming_named"].render(Style::Text);
        for c in d.contests.iter().filter(|c| c.status == Status::Scheduled) {
            let ci = d.contests.iter().position(|x| x.id == c.id).unwrap();
            assert!(named.contains(&d.contest_name(ci)), "{named}");
        }
    }

    #[test]
    fn every_contest_over_is_all_over() {
        let d = demo();
        let mut r = crate::dataset::changes::Records::of(&d);
        for c in r.contests.iter_mut().filter(|c| c.status != Status::Final) {
            // Nothing placed: a contest can be over with no result kept.
            c.status = Status::Final;
            for e in c.entries.iter_mut() {
                e.place = None;
                e.mark = None;
                e.award = None;
            }
        }
        let Ok(d) = r.build(2) else {
            panic!("the records load")
        };
        let (outcome, f) = facts(&d, &Slots::new());
        assert_eq!(outcome, "all_over");
        assert_eq!(f["decided_count"], Value::Int(d.contests.len() as i64));
    }
}
