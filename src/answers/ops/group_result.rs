//! `group_result`: how a team, delegation or party did in one contest —
//! each of its entries with place and mark ("how did the Greens do in
//! Fennick Green?", "how did Kalvenmark do in the men's 100 m final?").

use super::support::{
    entry_entity, mark_value, percent_value, rank_value, staleness, status_phrase, vote_facts,
    vote_shares, when_value,
};
use super::*;
use crate::answers::value::Style;
use crate::dataset::{EntryStatus, Status};

pub static SPEC: OpSpec = OpSpec {
    name: "group_result",
    summary: "how a team or party did in one contest",
    params: &[
        Param {
            name: "group",
            kind: EntityKind::Group,
            required: true,
        },
        Param {
            name: "contest",
            kind: EntityKind::Contest,
            required: true,
        },
    ],
    outcomes: &[
        answered(
            "answered",
            &[
                "name",
                "contest_name",
                "entries",
                "entries_count",
                "won",
                "award",
                "counted",
            ],
        ),
        answered(
            "live",
            &[
                "name",
                "contest_name",
                "entries",
                "entries_count",
                "counted",
                "stale",
            ],
        ),
        no_data(
            "scheduled",
            &["name", "contest_name", "start", "entries_count"],
        ),
        no_data("not_entered", &["name", "contest_name"]),
        no_data("no_result", &["name", "contest_name"]),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let (Some(EntityRef::Group(gi)), Some(ci)) = (input.entity("group"), input.contest("contest"))
    else {
        return OpOutput::done("no_result", Facts::new(), vec![]);
    };
    let c = &data.contests[ci];
    let mentioned = vec![EntityRef::Group(gi), EntityRef::Contest(ci)];
    let mut f = Facts::new()
        .set("name", data.group_name_value(gi))
        .set("contest_name", data.contest_name(ci));
    let ours: Vec<usize> = (0..c.entries.len())
        .filter(|&i| data.entry_group(&c.entries[i]) == Some(gi))
        .collect();
    if ours.is_empty() {
        return OpOutput::done("not_entered", f, mentioned);
    }
    f.put("entries_count", Value::Int(ours.len() as i64));
    if c.status == Status::Scheduled {
        f.put("start", when_value(&data.facts[ci].start, input.now));
        return OpOutput::done("scheduled", f, mentioned);
    }
    if super::support::no_votes_yet(data, ci)
        || ours
            .iter()
            .all(|&i| c.entries[i].place.is_none() && c.entries[i].status == EntryStatus::Ok)
    {
        return OpOutput::done("no_result", f, mentioned);
    }
    // Best placed first; those who did not finish last.
    let mut ours = ours;
    ours.sort_by_key(|&i| c.entries[i].place.unwrap_or(u32::MAX));
    let shares = vote_shares(data, ci);
    let lines: Vec<Value> = ours
        .iter()
        .map(|&i| {
            let e = &c.entries[i];
            // A team entry is the group itself: its line has no name.
            let who = match &e.competitor {
                Some(_) => format!("{} ", data.entry_name(e)),
                None => String::new(),
            };
            let Some(place) = e.place else {
                let why = match e.status {
                    EntryStatus::Ok if c.status == Status::Live => "no place yet",
                    EntryStatus::Ok => "not placed",
                    other => status_phrase(other),
                };
                return Value::Text(format!("{who}{why}").trim().to_string());
            };
            let shared = c
                .entries
                .iter()
                .enumerate()
                .any(|(j, o)| j != i && o.place == Some(place));
            let nth = rank_value(place, shared);
            let mark = mark_value(data, ci, i);
            let share = shares.as_ref().and_then(|s| s[i]).map(percent_value);
            let line = |style: Style| {
                let mut out = format!("{who}{}", nth.render(style));
                if let Some(m) = &mark {
                    out.push_str(&format!(" with {}", m.render(style)));
                }
                if let Some(s) = &share {
                    out.push_str(&match style {
                        Style::Text => format!(" ({})", s.render(style)),
                        _ => format!(", {}", s.render(style)),
                    });
                }
                out
            };
            Value::Dual {
                text: line(Style::Text),
                spoken: line(Style::Spoken),
            }
        })
        .collect();
    f.put("entries", Value::List(lines));
    vote_facts(data, ci, None, &mut f);
    let people: Vec<EntityRef> = ours
        .iter()
        .filter_map(|&i| {
            c.entries[i]
                .competitor
                .as_ref()
                .and(entry_entity(data, &c.entries[i]))
        })
        .collect();
    let mut mentioned = mentioned;
    mentioned.extend(people.iter().copied());
    if c.status == Status::Live {
        if let Some(s) = staleness(data, ci, input.now, input.stale_after) {
            f.put("stale", s);
        }
        return OpOutput::done("live", f, mentioned).about(people);
    }
    // The best award the group took here, and whether it won outright.
    let awards = data.awards();
    let best = ours
        .iter()
        .filter_map(|&i| c.entries[i].award.as_deref())
        .min_by_key(|a| awards.iter().position(|x| x == a));
    if let Some(a) = best {
        f.put("award", a);
        if awards.first().map(String::as_str) == Some(a) {
            f.put("won", "won");
        }
    }
    OpOutput::done("answered", f, mentioned).about(people)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::answers::ops::testing::{entity, run_with};
    use crate::dataset::demo;

    fn run_on(data: &crate::dataset::Dataset, group: &str, contest: &str) -> OpOutput {
        let gi = data.group(group).unwrap();
        let ci = data.contests.iter().position(|c| c.id == contest).unwrap();
        let mut slots = Slots::new();
        slots.insert("group".into(), entity(EntityRef::Group(gi)));
        slots.insert("contest".into(), entity(EntityRef::Contest(ci)));
        run_with(run, data, &slots)
    }

    fn said(out: &OpOutput, fact: &str) -> Option<String> {
        match out {
            OpOutput::Done { facts, .. } => facts.get(fact).map(|v| v.render(Style::Text)),
            other => panic!("{other:?}"),
        }
    }

    #[test]
    fn a_medal_winner_a_finisher_and_a_delegation_not_entered() {
        let d = demo();
        let out = run_on(&d, "kalvenmark", "ath-m-100m-final");
        assert_eq!(
            said(&out, "entries").unwrap(),
            "Lirust Dosavorn 2nd with 9.93 s"
        );
        assert_eq!(said(&out, "award").as_deref(), Some("silver"));
        assert_eq!(said(&out, "won"), None, "silver is not a win");
        let out = run_on(&d, "quessary", "ath-m-100m-final");
        assert_eq!(said(&out, "won").as_deref(), Some("won"));
        let out = run_on(&d, "brellmoor", "ath-m-100m-final");
        assert_eq!(said(&out, "award"), None);
        // Brellmoor has nobody in the women's 100 m final.
        match run_on(&d, "brellmoor", "ath-w-100m-final") {
            OpOutput::Done { outcome, .. } => assert_eq!(outcome, "not_entered"),
            other => panic!("{other:?}"),
        }
    }
}
