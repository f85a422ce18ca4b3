//! `placed`: who is at one place of a contest ("who came fifth", "who was
//! last", "who came second in Marrowby").

use super::support::{labels, mark_value, placed, rank_value, vote_facts, when_value};
use super::*;
use crate::dataset::Status;

pub static SPEC: OpSpec = OpSpec {
    name: "placed",
    summary: "who holds a given place of a contest",
    params: &[
        Param {
            name: "contest",
            kind: EntityKind::Contest,
            required: true,
        },
        Param {
            name: "place",
            kind: EntityKind::Place,
            required: true,
        },
    ],
    outcomes: &[
        answered(
            "answered",
            &[
                "contest_name",
                "holders",
                "place_nth",
                "mark",
                "share",
                "counted",
            ],
        ),
        answered(
            "live",
            &[
                "contest_name",
                "holders",
                "place_nth",
                "mark",
                "share",
                "counted",
                "stale",
            ],
        ),
        no_data(
            "no_such_place",
            &["contest_name", "place_nth", "placed_count"],
        ),
        no_data("scheduled", &["contest_name", "start"]),
        no_data("no_result", &["contest_name"]),
    ],
    run,
};

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
        return OpOutput::done("scheduled", f, vec![me]);
    }
    let order = placed(c);
    if order.is_empty() || super::support::no_votes_yet(data, ci) {
        return OpOutput::done("no_result", f, vec![me]);
    }
    let wanted = match input.slots.get("place") {
        Some(SlotValue::Place { value }) => *value,
        _ => return OpOutput::done("no_result", f, vec![me]),
    };
    // Last is the place of the last placed entry (those who did not finish
    // have no place to be last in).
    let place = if wanted == LAST_PLACE {
        order.last().and_then(|&i| c.entries[i].place).unwrap_or(1)
    } else {
        wanted
    };
    let at: Vec<usize> = order
        .iter()
        .copied()
        .filter(|&i| c.entries[i].place == Some(place))
        .collect();
    if at.is_empty() {
        // A place inside a tie ("3rd" after two joint 2nd) or past the end.
        f.put("place_nth", rank_value(wanted, false));
        f.put("placed_count", Value::Int(order.len() as i64));
        return OpOutput::done("no_such_place", f, vec![me]);
    }
    f.put("holders", labels(data, c, &at));
    f.put("place_nth", rank_value(place, at.len() > 1));
    if let Some(m) = mark_value(data, ci, at[0]) {
        f.put("mark", m);
    }
    vote_facts(data, ci, Some(at[0]), &mut f);
    let subjects: Vec<EntityRef> = at
        .iter()
        .filter_map(|&i| super::support::entry_entity(data, &c.entries[i]))
        .collect();
    let mut mentioned = vec![me];
    mentioned.extend(subjects.iter().copied());
    if c.status == Status::Live {
        if let Some(s) = super::support::staleness(data, ci, input.now, input.stale_after) {
            f.put("stale", s);
        }
        return OpOutput::done("live", f, mentioned).about(subjects);
    }
    OpOutput::done("answered", f, mentioned).about(subjects)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::answers::ops::testing::{entity, run_with};

    fn games() -> Dataset {
        let dir = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("dataset-demo/games");
        crate::dataset::load_dir(&dir).unwrap()
    }

    fn ask(data: &Dataset, contest: &str, place: u32) -> OpOutput {
        let ci = data.contests.iter().position(|c| c.id == contest).unwrap();
        let mut slots = Slots::new();
        slots.insert("contest".into(), entity(EntityRef::Contest(ci)));
        slots.insert("place".into(), SlotValue::Place { value: place });
        run_with(run, data, &slots)
    }

    fn holders(o: &OpOutput) -> (String, String) {
        let OpOutput::Done { outcome, facts, .. } = o else {
            panic!("{o:?}")
        };
        let h = facts
            .get("holders")
            .map(|v| v.render(crate::answers::value::Style::Text))
            .unwrap_or_default();
        (outcome.to_string(), h)
    }

    #[test]
    fn the_holder_of_a_place_and_the_last_placed() {
        let d = games();
        // Worked out from dataset-demo/games/contests.json: the men's 100 m
        // heat 1 placed p001 first and p015 eighth and last.
        let (o, h) = holders(&ask(&d, "ath-m-100m-heat-1", 1));
        assert_eq!(o, "answered");
        assert!(h.contains(&d.competitors[0].name()), "{h}");
        let (_, last) = holders(&ask(&d, "ath-m-100m-heat-1", LAST_PLACE));
        let (_, eighth) = holders(&ask(&d, "ath-m-100m-heat-1", 8));
        assert_eq!(last, eighth);
        let (o, _) = holders(&ask(&d, "ath-m-100m-heat-1", 30));
        assert_eq!(o, "no_such_place");
    }
}
