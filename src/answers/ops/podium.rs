//! `podium`: who won a contest and who took each award, or who holds one
//! award when the reader asks for it ("and who got silver?").

use super::support::{holders, labels, placed, when_value};
use super::*;
use crate::dataset::Status;

pub static SPEC: OpSpec = OpSpec {
    name: "podium",
    summary: "the winner and medallists of a contest",
    params: &[
        Param {
            name: "contest",
            kind: EntityKind::Contest,
            required: true,
        },
        Param {
            name: "award",
            kind: EntityKind::Award,
            required: false,
        },
    ],
    outcomes: &[
        // Everyone on the podium; `missing` lists awards not given (a tie).
        answered(
            "answered",
            &[
                "winner",
                "gold",
                "silver",
                "bronze",
                "missing",
                "missing_count",
                "mark",
                "share",
                "counted",
            ],
        ),
        // The holders of the one award asked for.
        answered("award", &["holders", "shared"]),
        // The asked-for award was not given, because of a tie above it.
        answered("not_awarded", &["tied", "tied_award"]),
        // A round that gives no medals (a heat): the first three places.
        answered("placings", &["first", "second", "third"]),
        // An award asked for in a round that gives none.
        answered("no_awards", &[]),
        // Still under way: who leads now.
        so_far("live", &["leader", "mark", "stale", "share", "counted"]),
        no_data("scheduled", &["start"]),
        no_data("no_result", &[]),
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
    match c.status {
        Status::Scheduled => {
            return OpOutput::done(
                "scheduled",
                Facts::new().set("start", when_value(&data.facts[ci].start, input.now)),
                vec![me],
            )
        }
        // A contest put off or abandoned has no result to give.
        Status::Postponed | Status::Abandoned => {
            return OpOutput::done("no_result", Facts::new(), vec![me]);
        }
        Status::Live | Status::Suspended => {
            let order = placed(c);
            let Some(&first) = order
                .first()
                .filter(|_| !super::support::no_votes_yet(data, ci))
            else {
                return OpOutput::done("live", Facts::new(), vec![me]);
            };
            let leaders: Vec<usize> = order
                .iter()
                .copied()
                .filter(|&i| c.entries[i].place == c.entries[first].place)
                .collect();
            let mut f = Facts::new().set("leader", labels(data, c, &leaders));
            if let Some(m) = super::support::mark_value(data, ci, first) {
                f.put("mark", m);
            }
            super::support::vote_facts(data, ci, Some(first), &mut f);
            if let Some(s) = super::support::staleness(data, ci, input.now, input.stale_after) {
                f.put("stale", s);
            }
            let who = entities(data, c, &leaders);
            let mentioned = std::iter::once(me).chain(who.iter().copied()).collect();
            return OpOutput::done("live", f, mentioned).about(who);
        }
        Status::Final => {}
    }
    if !data.awards_in(ci) {
        // Heats give places, not medals: naming a "winner" with medals here
        // would be wrong, so say who placed and, if asked, that there are
        // no medals in this round.
        if input.text("award").is_some() {
            return OpOutput::done("no_awards", Facts::new(), vec![me]);
        }
        let order = placed(c);
        if order.is_empty() {
            return OpOutput::done("no_result", Facts::new(), vec![me]);
        }
        let mut f = Facts::new();
        let mut mentioned = vec![me];
        let mut firsts = Vec::new();
        for (place, key) in [(1, "first"), (2, "second"), (3, "third")] {
            let ix: Vec<usize> = order
                .iter()
                .copied()
                .filter(|&i| c.entries[i].place == Some(place))
                .collect();
            let who = entities(data, c, &ix);
            if place == 1 {
                firsts = who.clone();
            }
            mentioned.extend(who);
            f.put(key, labels(data, c, &ix));
        }
        return OpOutput::done("placings", f, mentioned).about(firsts);
    }
    let awards = data.awards();
    if let Some(award) = input.text("award") {
        let ix = holders(c, award);
        if ix.is_empty() {
            // Say why: which award above it was shared.
            let pos = awards.iter().position(|a| a == award).unwrap_or(0);
            for above in awards[..pos].iter().rev() {
                let h = holders(c, above);
                if h.len() > 1 {
                    let f = Facts::new()
                        .set("tied", labels(data, c, &h))
                        .set("tied_award", above.as_str());
                    return OpOutput::done("not_awarded", f, vec![me]);
                }
            }
            return OpOutput::done("no_result", Facts::new(), vec![me]);
        }
        let who = entities(data, c, &ix);
        let mentioned = std::iter::once(me).chain(who.iter().copied()).collect();
        let f = Facts::new()
            .set("holders", labels(data, c, &ix))
            .set("shared", if ix.len() > 1 { "shared" } else { "" });
        return OpOutput::done("award", f, mentioned).about(who);
    }
    if placed(c).is_empty() {
        return OpOutput::done("no_result", Facts::new(), vec![me]);
    }
    let mut f = Facts::new();
    let mut missing = Vec::new();
    let mut mentioned = vec![me];
    let mut winners = Vec::new();
    for (k, a) in awards.iter().enumerate() {
        let ix = holders(c, a);
        if ix.is_empty() {
            missing.push(a.clone());
        }
        let who = entities(data, c, &ix);
        if k == 0 {
            winners = who.clone();
        }
        mentioned.extend(who);
        // The first three awards have fixed fact names editors can use.
        let key = match k {
            0 => "gold",
            1 => "silver",
            2 => "bronze",
            _ => continue,
        };
        f.put(key, labels(data, c, &ix));
        if k == 0 {
            f.put("winner", labels(data, c, &ix));
        }
    }
    // The winner's own figures: the mark, and for a vote count the share
    // and how much of the count is in (a race can be called before the
    // count ends).
    if let Some(&first) = placed(c).first() {
        if let Some(m) = super::support::mark_value(data, ci, first) {
            f.put("mark", m);
        }
        super::support::vote_facts(data, ci, Some(first), &mut f);
    }
    f.put("missing_count", Value::Int(missing.len() as i64));
    f.put("missing", Value::from(missing));
    OpOutput::done("answered", f, mentioned).about(winners)
}

/// The competitors (or groups, for team entries) behind some entries.
fn entities(data: &Dataset, c: &crate::dataset::Contest, ix: &[usize]) -> Vec<EntityRef> {
    ix.iter()
        .filter_map(|&i| super::support::entry_entity(data, &c.entries[i]))
        .collect()
}
