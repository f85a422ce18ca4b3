//! `contest_time`: when a contest starts (or started), where, and how far
//! along it is (how much of a count is in, when the data say).

use super::support::{contest_facts, staleness, updated_value, vote_facts};
use super::*;
use crate::dataset::Status;

pub static SPEC: OpSpec = OpSpec {
    name: "contest_time",
    summary: "when and where a contest takes place, and how far along it is",
    params: &[Param {
        name: "contest",
        kind: EntityKind::Contest,
        required: true,
    }],
    outcomes: &[
        answered("upcoming", &["contest_name", "start", "venue"]),
        answered(
            "live",
            &[
                "contest_name",
                "start",
                "venue",
                "counted",
                "updated",
                "stale",
            ],
        ),
        answered("over", &["contest_name", "start", "venue", "counted"]),
        // Put off, abandoned or suspended: `status` says which, and
        // `start` when it was (or is now) due.
        answered("off", &["contest_name", "start", "venue", "status"]),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let Some(ci) = input.contest("contest") else {
        return OpOutput::Choose {
            slot: "contest",
            options: vec![],
        };
    };
    let mut f = Facts::new();
    contest_facts(data, ci, input.now, &mut f);
    let outcome = match data.contests[ci].status {
        Status::Scheduled => "upcoming",
        Status::Live => {
            if let Some(t) = updated_value(data, ci) {
                f.put("updated", t);
            }
            if let Some(s) = staleness(data, ci, input.now, input.stale_after) {
                f.put("stale", s);
            }
            "live"
        }
        Status::Final => "over",
        s @ (Status::Postponed | Status::Abandoned | Status::Suspended) => {
            f.put("status", Value::Text(s.name().to_string()));
            "off"
        }
    };
    if !matches!(
        data.contests[ci].status,
        Status::Scheduled | Status::Postponed
    ) {
        vote_facts(data, ci, None, &mut f);
    }
    OpOutput::done(outcome, f, vec![EntityRef::Contest(ci)])
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::answers::ops::testing::{entity, run_with};
    use crate::answers::value::Style;
    use crate::dataset::sides::testing::league;

    #[test]
    fn a_contest_put_off_says_so_with_its_status() {
        let d = league(
            &["ash", "birch"],
            &[
                ("m1", "ash", "birch", "postponed", None),
                ("m2", "birch", "ash", "abandoned", Some((1, 0))),
                ("m3", "ash", "birch", "suspended", Some((0, 0))),
            ],
            "",
        )
        .unwrap();
        for (ci, status) in [(0, "postponed"), (1, "abandoned"), (2, "suspended")] {
            let mut slots = Slots::new();
            slots.insert("contest".into(), entity(EntityRef::Contest(ci)));
            match run_with(run, &d, &slots) {
                OpOutput::Done { outcome, facts, .. } => {
                    assert_eq!(outcome, "off");
                    assert_eq!(facts["status"].render(Style::Text), status);
                }
                other => panic!("{other:?}"),
            }
        }
    }
}
