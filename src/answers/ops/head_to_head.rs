//! `head_to_head`: which of two competitors finished ahead in a contest they
//! both took part in.

use super::support::{mark_value, status_phrase};
use super::*;
use crate::dataset::{EntryStatus, Status};

pub static SPEC: OpSpec = OpSpec {
    name: "head_to_head",
    summary: "which of two competitors finished ahead",
    params: &[
        Param {
            name: "competitor",
            kind: EntityKind::Competitor,
            required: true,
        },
        Param {
            name: "rival",
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
                "ahead",
                "behind",
                "ahead_place",
                "behind_place",
                "ahead_mark",
                "behind_mark",
                "contest_name",
            ],
        ),
        answered(
            "one_out",
            &[
                "finisher",
                "finisher_place",
                "other",
                "other_status",
                "contest_name",
            ],
        ),
        answered("level", &["names", "place", "contest_name"]),
        // Both placed in a contest still under way: who is ahead so far.
        so_far(
            "ahead_so_far",
            &[
                "ahead",
                "behind",
                "ahead_place",
                "behind_place",
                "ahead_mark",
                "behind_mark",
                "contest_name",
                "counted",
                "stale",
            ],
        ),
        no_data("undecided", &["contest_name"]),
        no_data("never_met", &["names"]),
        // Both named, both competed, but not both in the event asked about.
        no_data("not_both_in", &["names", "contest_name"]),
    ],
    run,
};

fn place_value(p: u32) -> Value {
    Value::ordinal(p as u64)
}

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let (Some(a), Some(b)) = (input.competitor("competitor"), input.competitor("rival")) else {
        return OpOutput::done("never_met", Facts::new(), vec![]);
    };
    if a == b {
        // One person twice ("did she beat her?" with one woman in mind) is
        // no comparison: ask who the other one is.
        return OpOutput::Choose {
            slot: "rival",
            options: vec![],
        };
    }
    let names = Value::from(vec![data.competitors[a].name(), data.competitors[b].name()]);
    let mentioned = vec![EntityRef::Competitor(a), EntityRef::Competitor(b)];
    let ca = data.contests_of(a);
    let cb = data.contests_of(b);
    let mut shared: Vec<(usize, usize, usize)> = ca
        .iter()
        .filter_map(|&(c, ea)| cb.iter().find(|(d, _)| *d == c).map(|&(_, eb)| (c, ea, eb)))
        .collect();
    if let Some(ci) = input.contest("contest") {
        let met_elsewhere = !shared.is_empty();
        shared.retain(|(c, _, _)| *c == ci);
        if shared.is_empty() && met_elsewhere {
            // They met, just not in this event: "never met" would be false.
            let f = Facts::new()
                .set("names", names)
                .set("contest_name", data.contest_name(ci));
            return OpOutput::done("not_both_in", f, mentioned);
        }
    }
    let (ci, ea, eb) = match shared.as_slice() {
        [] => return OpOutput::done("never_met", Facts::new().set("names", names), mentioned),
        [one] => *one,
        many => {
            return OpOutput::Choose {
                slot: "contest",
                options: many
                    .iter()
                    .map(|(c, _, _)| EntityRef::Contest(*c))
                    .collect(),
            }
        }
    };
    let c = &data.contests[ci];
    let mut f = Facts::new().set("contest_name", data.contest_name(ci));
    let mut mentioned = mentioned;
    mentioned.push(EntityRef::Contest(ci));
    // Standings in a contest still under way are not a result: "did A beat
    // B" is only answered once it is final, and while it is live the reply
    // says who is ahead so far.
    let (xa, xb) = (&c.entries[ea], &c.entries[eb]);
    if c.status == Status::Live && !super::support::no_votes_yet(data, ci) {
        if let (Some(pa), Some(pb)) = (xa.place, xb.place) {
            if pa != pb {
                let ((w, wp, we), (l, lp, le)) = if pa < pb {
                    ((a, pa, ea), (b, pb, eb))
                } else {
                    ((b, pb, eb), (a, pa, ea))
                };
                f.put("ahead", data.competitors[w].name());
                f.put("behind", data.competitors[l].name());
                f.put("ahead_place", place_value(wp));
                f.put("behind_place", place_value(lp));
                if let Some(m) = mark_value(data, ci, we) {
                    f.put("ahead_mark", m);
                }
                if let Some(m) = mark_value(data, ci, le) {
                    f.put("behind_mark", m);
                }
                super::support::vote_facts(data, ci, None, &mut f);
                if let Some(s) = super::support::staleness(data, ci, input.now, input.stale_after) {
                    f.put("stale", s);
                }
                return OpOutput::done("ahead_so_far", f, mentioned);
            }
        }
    }
    if c.status != Status::Final {
        return OpOutput::done("undecided", f, mentioned);
    }
    match (xa.place, xb.place) {
        (Some(pa), Some(pb)) if pa == pb => {
            f.put("names", names);
            f.put("place", place_value(pa));
            OpOutput::done("level", f, mentioned)
        }
        (Some(pa), Some(pb)) => {
            let ((w, wp, we), (l, lp, le)) = if pa < pb {
                ((a, pa, ea), (b, pb, eb))
            } else {
                ((b, pb, eb), (a, pa, ea))
            };
            f.put("ahead", data.competitors[w].name());
            f.put("behind", data.competitors[l].name());
            f.put("ahead_place", place_value(wp));
            f.put("behind_place", place_value(lp));
            if let Some(m) = mark_value(data, ci, we) {
                f.put("ahead_mark", m);
            }
            if let Some(m) = mark_value(data, ci, le) {
                f.put("behind_mark", m);
            }
            OpOutput::done("answered", f, mentioned)
        }
        (Some(p), None) | (None, Some(p)) => {
            let (fin, other, oe) = if xa.place.is_some() {
                (a, b, xb)
            } else {
                (b, a, xa)
            };
            if oe.status == EntryStatus::Ok {
                return OpOutput::done("undecided", f, mentioned);
            }
            f.put("finisher", data.competitors[fin].name());
            f.put("finisher_place", place_value(p));
            f.put("other", data.competitors[other].name());
            f.put("other_status", status_phrase(oe.status));
            OpOutput::done("one_out", f, mentioned)
        }
        (None, None) => OpOutput::done("undecided", f, mentioned),
    }
}
