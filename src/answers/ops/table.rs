//! `table`: a table the engine computes from the results with the
//! scenario's rules (`dataset::table`): the whole table or its top N, the
//! bottom, who is in a place, a team's position and points, and the gap
//! between two teams or to the leader, all computed, never stored.

use super::support::{breakdown, rank_value};
use super::team_support::{chosen_table, games_value, points_value};
use super::*;
use crate::answers::value::Style;
use crate::answers::words;
use crate::dataset::table::{TableCount, TableRow};

pub static SPEC: OpSpec = OpSpec {
    name: "table",
    summary: "a table computed from the results: top, bottom, a team's place, gaps",
    params: &[
        Param {
            name: "group",
            kind: EntityKind::Group,
            required: false,
        },
        // A second team, for the gap between two.
        Param {
            name: "rival",
            kind: EntityKind::Group,
            required: false,
        },
        Param {
            name: "count",
            kind: EntityKind::Count,
            required: false,
        },
        Param {
            name: "place",
            kind: EntityKind::Place,
            required: false,
        },
        // The competition named ("the league table"): the table of that
        // discipline, when the scenario declares one.
        Param {
            name: "discipline",
            kind: EntityKind::Discipline,
            required: false,
        },
    ],
    outcomes: &[
        answered(
            "top",
            &[
                "table_name",
                "rows",
                "shown",
                "teams",
                "leader",
                "leaders_count",
                "leader_points",
                "still_to_play",
            ],
        ),
        answered(
            "bottom",
            &[
                "table_name",
                "rows",
                "shown",
                "teams",
                "last",
                "last_points",
            ],
        ),
        answered(
            "position",
            &[
                "table_name",
                "name",
                "place",
                "points",
                "played",
                "won",
                "drawn",
                "lost",
                "scored",
                "conceded",
                "difference",
                "leader",
                "gap",
                "in_hand",
                "teams",
            ],
        ),
        answered(
            "leading",
            &[
                "table_name",
                "name",
                "points",
                "played",
                "lead",
                "second",
                "shared",
            ],
        ),
        answered(
            "gap",
            &[
                "table_name",
                "name",
                "rival",
                "ahead",
                "behind",
                "gap",
                "ahead_place",
                "behind_place",
                "in_hand",
            ],
        ),
        answered("level", &["table_name", "name", "rival", "points", "place"]),
        answered("at_place", &["table_name", "place", "holders", "points"]),
        no_data("no_such_place", &["table_name", "place", "teams"]),
        no_data("not_in_table", &["table_name", "name"]),
        no_data("empty", &["table_name"]),
        no_data("no_table", &[]),
    ],
    run,
};

/// How many rows to list when neither the reader nor `settings.rows` says.
const DEFAULT_ROWS: usize = 10;
/// How many rows "the bottom" lists unless told.
const DEFAULT_BOTTOM_ROWS: usize = 3;

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let named = match input.entity("discipline") {
        Some(EntityRef::Discipline(si, di)) => Some((si, di)),
        _ => None,
    };
    let table = match named {
        Some((si, di)) => data.tables.iter().find(|t| {
            let r = data.table_rule(t);
            r.sport.as_deref() == Some(data.sports[si].id.as_str())
                && r.discipline.as_deref() == Some(data.sports[si].disciplines[di].id.as_str())
        }),
        None => chosen_table(data, input.settings),
    };
    let Some(table) = table else {
        return OpOutput::done("no_table", Facts::new(), vec![]);
    };
    let rule = data.table_rule(table);
    let mut f = Facts::new().set("table_name", rule.name.clone());
    let rows = &table.rows;
    let played = rows.iter().any(|r| r.played > 0 || r.total() > 0);
    if rows.is_empty() || !played {
        return OpOutput::done("empty", f, vec![]);
    }
    f.put("teams", Value::Int(rows.len() as i64));
    let group = |name: &str| match input.entity(name) {
        Some(EntityRef::Group(g)) => Some(g),
        _ => None,
    };
    let shared = |r: &TableRow| rows.iter().filter(|x| x.rank == r.rank).count() > 1;
    let name_of = |r: &TableRow| data.group_name_value(r.group);
    let value_of = |r: &TableRow| match rule.count {
        TableCount::Results => points_value(r.points),
        TableCount::Awards => breakdown(data, &r.awards, false),
    };

    if let (Some(a), Some(b)) = (group("group"), group("rival")) {
        let (Some(ra), Some(rb)) = (table.row_of(a), table.row_of(b)) else {
            let missing = if table.row_of(a).is_none() { a } else { b };
            f.put("name", data.group_name_value(missing));
            return OpOutput::done("not_in_table", f, vec![EntityRef::Group(missing)]);
        };
        f.put("name", name_of(ra));
        f.put("rival", name_of(rb));
        let mentioned = vec![EntityRef::Group(a), EntityRef::Group(b)];
        let (pa, pb) = (sort_value(rule.count, ra), sort_value(rule.count, rb));
        if pa == pb {
            f.put("points", value_of(ra));
            if ra.rank == rb.rank {
                f.put("place", rank_value(ra.rank, true));
            }
            return OpOutput::done("level", f, mentioned);
        }
        let (ahead, behind) = if ra.rank <= rb.rank {
            (ra, rb)
        } else {
            (rb, ra)
        };
        f.put("ahead", name_of(ahead));
        f.put("behind", name_of(behind));
        f.put("gap", gap_value(rule.count, ahead, behind));
        if let Some(n) = in_hand(ahead, behind) {
            f.put("in_hand", n);
        }
        f.put("ahead_place", rank_value(ahead.rank, shared(ahead)));
        f.put("behind_place", rank_value(behind.rank, shared(behind)));
        return OpOutput::done("gap", f, mentioned).about(vec![EntityRef::Group(ahead.group)]);
    }

    if let Some(g) = group("group") {
        let Some(r) = table.row_of(g) else {
            f.put("name", data.group_name_value(g));
            return OpOutput::done("not_in_table", f, vec![EntityRef::Group(g)]);
        };
        let me = vec![EntityRef::Group(g)];
        f.put("name", name_of(r));
        f.put("points", value_of(r));
        f.put("played", games_value(r.played));
        if r.rank == 1 {
            // The lead over the best row below the leaders; zero when
            // the top is shared.
            let second = rows.iter().find(|x| x.rank > 1);
            f.put("shared", Value::Int(shared(r) as i64));
            if let Some(s) = second.filter(|_| !shared(r)) {
                f.put("lead", gap_value(rule.count, r, s));
                f.put("second", name_of(s));
            }
            return OpOutput::done("leading", f, me.clone()).about(me);
        }
        f.put("place", rank_value(r.rank, shared(r)));
        f.put("won", Value::Int(r.won as i64));
        f.put("drawn", Value::Int(r.drawn as i64));
        f.put("lost", Value::Int(r.lost as i64));
        f.put("scored", Value::Int(r.scored as i64));
        f.put("conceded", Value::Int(r.conceded as i64));
        f.put("difference", signed_value(r.difference()));
        let leaders: Vec<Value> = rows.iter().filter(|x| x.rank == 1).map(name_of).collect();
        f.put("leader", names(leaders));
        f.put("gap", gap_value(rule.count, &rows[0], r));
        if let Some(n) = in_hand(&rows[0], r) {
            f.put("in_hand", n);
        }
        return OpOutput::done("position", f, me.clone()).about(me);
    }

    if let Some(SlotValue::Place { value }) = input.slots.get("place") {
        let last = rows.last().map(|r| r.rank).unwrap_or(1);
        let place = if *value == LAST_PLACE { last } else { *value };
        f.put("place", Value::ordinal(place as u64));
        let holders: Vec<&TableRow> = rows.iter().filter(|r| r.rank == place).collect();
        if holders.is_empty() {
            return OpOutput::done("no_such_place", f, vec![]);
        }
        f.put(
            "holders",
            names(holders.iter().map(|r| name_of(r)).collect()),
        );
        f.put("points", value_of(holders[0]));
        let who: Vec<EntityRef> = holders.iter().map(|r| EntityRef::Group(r.group)).collect();
        return OpOutput::done("at_place", f, who.clone()).about(who);
    }

    let bottom = input.settings.get("view").map(String::as_str) == Some("bottom");
    let n = input.rows(if bottom {
        DEFAULT_BOTTOM_ROWS
    } else {
        DEFAULT_ROWS
    });
    // A cut never splits a shared place.
    let shown: Vec<&TableRow> = if bottom {
        let cut = rows[rows.len().saturating_sub(n)].rank;
        rows.iter().filter(|r| r.rank >= cut).collect()
    } else {
        let cut = rows[n.min(rows.len()) - 1].rank;
        rows.iter().filter(|r| r.rank <= cut).collect()
    };
    let lines: Vec<Value> = shown.iter().map(|r| line(rule.count, data, r)).collect();
    f.put("shown", Value::Int(lines.len() as i64));
    f.put("rows", Value::List(lines));
    let mentioned: Vec<EntityRef> = shown.iter().map(|r| EntityRef::Group(r.group)).collect();
    if bottom {
        let last_rank = rows.last().map(|r| r.rank).unwrap_or(1);
        let last: Vec<&TableRow> = rows.iter().filter(|r| r.rank == last_rank).collect();
        f.put("last", names(last.iter().map(|r| name_of(r)).collect()));
        f.put("last_points", value_of(last[0]));
        let who = last.iter().map(|r| EntityRef::Group(r.group)).collect();
        return OpOutput::done("bottom", f, mentioned).about(who);
    }
    let leaders: Vec<&TableRow> = rows.iter().filter(|r| r.rank == 1).collect();
    f.put(
        "leader",
        names(leaders.iter().map(|r| name_of(r)).collect()),
    );
    f.put("leaders_count", Value::Int(leaders.len() as i64));
    f.put("leader_points", value_of(leaders[0]));
    f.put("still_to_play", Value::Int(table.still_to_play as i64));
    let who = leaders.iter().map(|r| EntityRef::Group(r.group)).collect();
    OpOutput::done("top", f, mentioned).about(who)
}

/// Games the team behind has in hand over the one ahead (played fewer),
/// as "one game"; `None` when it has none.
fn in_hand(ahead: &TableRow, behind: &TableRow) -> Option<Value> {
    (behind.played < ahead.played).then(|| games_value(ahead.played - behind.played))
}

/// Names as one value: a single name keeps its own verb agreement
/// ("Ambervale Town are"), several make a list.
fn names(mut v: Vec<Value>) -> Value {
    if v.len() == 1 {
        v.remove(0)
    } else {
        Value::List(v)
    }
}

/// What a row is ranked by first, for "level" and gaps: points in a
/// results table, the award counts in an awards table.
fn sort_value(count: TableCount, r: &TableRow) -> Vec<i64> {
    match count {
        TableCount::Results => vec![r.points],
        TableCount::Awards => r.awards.iter().map(|&n| n as i64).collect(),
    }
}

/// The gap from `ahead` down to `behind`: points in a results table, the
/// number of awards in an awards table.
fn gap_value(count: TableCount, ahead: &TableRow, behind: &TableRow) -> Value {
    match count {
        TableCount::Results => points_value(ahead.points - behind.points),
        TableCount::Awards => {
            let n = ahead.total() as i64 - behind.total() as i64;
            let unit = if n.abs() == 1 { "award" } else { "awards" };
            Value::Dual {
                text: format!("{} {unit}", int_words(n, Style::Text, false)),
                spoken: format!("{} {unit}", int_words(n, Style::Spoken, false)),
            }
        }
    }
}

use crate::answers::value::int_words;

/// A goal difference: "+11", "-3", "0"; spoken "plus eleven".
fn signed_value(n: i64) -> Value {
    let sign = match n.signum() {
        1 => ("+", "plus "),
        -1 => ("-", "minus "),
        _ => ("", ""),
    };
    Value::Dual {
        text: format!("{}{}", sign.0, n.abs()),
        spoken: format!("{}{}", sign.1, words::cardinal(n.unsigned_abs())),
    }
}

/// One row as listed: "1. Harrowby Town 25 points from 12 games" (spoken
/// "first, Harrowby Town, twenty-five points from twelve games"); in an
/// awards table "1. Kalvenmark (seven gold and one silver)".
fn line(count: TableCount, data: &Dataset, r: &TableRow) -> Value {
    let name = &data.groups[r.group].name;
    match count {
        TableCount::Results => {
            let p = points_value(r.points);
            let g = games_value(r.played);
            Value::Dual {
                text: format!(
                    "{}. {name} {} from {}",
                    r.rank,
                    p.render(Style::Text),
                    g.render(Style::Text)
                ),
                spoken: format!(
                    "{}, {name}, {} from {}",
                    words::ordinal(r.rank as u64),
                    p.render(Style::Spoken),
                    g.render(Style::Spoken)
                ),
            }
        }
        TableCount::Awards => {
            let b = breakdown(data, &r.awards, false);
            Value::Dual {
                text: format!("{}. {name} ({})", r.rank, b.render(Style::Text)),
                spoken: format!(
                    "{}, {name}, with {}",
                    words::ordinal(r.rank as u64),
                    b.render(Style::Spoken)
                ),
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::answers::ops::testing::{entity, run_with};
    use crate::dataset::sides::testing::league;

    const RULE: &str = r#""tables":[{"id":"league","name":"League table","count":"results","order":["points","difference","scored"]}]"#;

    fn data() -> Dataset {
        league(
            &["ash", "birch", "cedar", "dale"],
            &[
                ("m1", "ash", "birch", "final", Some((3, 0))),
                ("m2", "cedar", "dale", "final", Some((1, 1))),
                ("m3", "birch", "cedar", "final", Some((2, 1))),
                ("m4", "dale", "ash", "final", Some((0, 2))),
                ("m5", "ash", "cedar", "scheduled", None),
            ],
            RULE,
        )
        .unwrap()
    }

    fn run_on(d: &Dataset, slots: &[(&str, SlotValue)]) -> (String, HashMap<String, Value>) {
        let slots: Slots = slots
            .iter()
            .map(|(k, v)| (k.to_string(), v.clone()))
            .collect();
        match run_with(run, d, &slots) {
            OpOutput::Done { outcome, facts, .. } => (outcome.to_string(), facts),
            other => panic!("{other:?}"),
        }
    }

    fn group(d: &Dataset, id: &str) -> SlotValue {
        entity(EntityRef::Group(d.group(id).unwrap()))
    }

    #[test]
    fn the_top_lists_rows_with_points_and_games() {
        let d = data();
        let (o, f) = run_on(&d, &[]);
        assert_eq!(o, "top");
        assert_eq!(
            f["rows"].render(Style::Text),
            "1. Ash FC six points from two games, 2. Birch FC three points from two games, \
             3. Cedar FC one point from two games and 4. Dale FC one point from two games"
        );
        assert_eq!(f["leader"].render(Style::Text), "Ash FC");
        assert_eq!(f["still_to_play"], Value::Int(1));
        let (_, f) = run_on(&d, &[("count", SlotValue::Count { value: 2 })]);
        assert_eq!(f["shown"], Value::Int(2));
    }

    #[test]
    fn a_team_gets_its_place_points_and_gap_to_the_leader() {
        let d = data();
        let (o, f) = run_on(&d, &[("group", group(&d, "cedar"))]);
        assert_eq!(o, "position");
        assert_eq!(f["place"].render(Style::Text), "3rd");
        assert_eq!(f["gap"].render(Style::Text), "five points");
        assert_eq!(f["difference"].render(Style::Text), "-1");
        let (o, f) = run_on(&d, &[("group", group(&d, "ash"))]);
        assert_eq!(o, "leading");
        assert_eq!(f["lead"].render(Style::Text), "three points");
        assert_eq!(f["second"].render(Style::Text), "Birch FC");
    }

    #[test]
    fn the_gap_between_two_teams_and_a_level_pair() {
        let d = data();
        let (o, f) = run_on(
            &d,
            &[("group", group(&d, "dale")), ("rival", group(&d, "ash"))],
        );
        assert_eq!(o, "gap");
        assert_eq!(f["ahead"].render(Style::Text), "Ash FC");
        assert_eq!(f["gap"].render(Style::Text), "five points");
        let (o, _) = run_on(
            &d,
            &[("group", group(&d, "cedar")), ("rival", group(&d, "dale"))],
        );
        assert_eq!(o, "level");
        // Everyone has played two: no games in hand.
        assert!(!f.contains_key("in_hand"));
    }

    #[test]
    fn games_in_hand_are_counted_for_the_team_behind() {
        let d = league(
            &["ash", "birch", "cedar"],
            &[
                ("m1", "ash", "birch", "final", Some((1, 0))),
                ("m2", "ash", "cedar", "final", Some((1, 0))),
                ("m3", "birch", "cedar", "scheduled", None),
            ],
            RULE,
        )
        .unwrap();
        let (o, f) = run_on(
            &d,
            &[("group", group(&d, "birch")), ("rival", group(&d, "ash"))],
        );
        assert_eq!(o, "gap");
        assert_eq!(f["in_hand"].render(Style::Text), "one game");
        let (_, f) = run_on(&d, &[("group", group(&d, "cedar"))]);
        assert_eq!(f["in_hand"].render(Style::Text), "one game");
    }

    #[test]
    fn the_bottom_and_a_place() {
        let d = data();
        let (o, f) = run_on(&d, &[("place", SlotValue::Place { value: LAST_PLACE })]);
        assert_eq!(o, "at_place");
        assert_eq!(f["holders"].render(Style::Text), "Dale FC");
        let (o, f) = run_on(&d, &[("place", SlotValue::Place { value: 9 })]);
        assert_eq!(o, "no_such_place");
        assert_eq!(f["teams"], Value::Int(4));
    }

    #[test]
    fn no_table_and_nothing_played() {
        let d = league(&["ash", "birch"], &[], "").unwrap();
        assert_eq!(run_on(&d, &[]).0, "no_table");
        let d = league(
            &["ash", "birch"],
            &[("m1", "ash", "birch", "scheduled", None)],
            RULE,
        )
        .unwrap();
        assert_eq!(run_on(&d, &[]).0, "empty");
    }
}
