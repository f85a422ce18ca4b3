//! `group_medals`: a team's or delegation's award count and its place in the
//! medal table.

use super::support::{awards_still_open, contest_scope, medal_facts, medal_table_of, rank_value};
use super::*;

pub static SPEC: OpSpec = OpSpec {
    name: "group_medals",
    summary: "a delegation's medal count and rank",
    params: &[
        Param {
            name: "group",
            kind: EntityKind::Group,
            required: true,
        },
        // Optional limits: one sport, one day, one award ("golds").
        Param {
            name: "sport",
            kind: EntityKind::Sport,
            required: false,
        },
        Param {
            name: "date",
            kind: EntityKind::Date,
            required: false,
        },
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
                "gold",
                "silver",
                "bronze",
                "total",
                "breakdown",
                "rank",
                "shared_with",
                "still_open",
                "scope",
            ],
        ),
        answered(
            "award",
            &["name", "award", "award_count", "scope", "still_open"],
        ),
        answered("none", &["name", "still_open", "scope"]),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let Some(EntityRef::Group(gi)) = input.entity("group") else {
        return OpOutput::done("none", Facts::new(), vec![]);
    };
    let mentioned = vec![EntityRef::Group(gi)];
    let mut f = Facts::new()
        .set("name", data.group_name_value(gi))
        .set("still_open", Value::Int(awards_still_open(data) as i64));
    let (keep, scope) = contest_scope(input);
    if let Some(s) = scope {
        f.put("scope", s);
    }
    let table = medal_table_of(data, &keep);
    let row = table.iter().find(|r| r.group == gi);
    if let Some(award) = input.text("award") {
        let k = data.awards().iter().position(|a| a == award);
        let n = match (row, k) {
            (Some(r), Some(k)) => r.counts[k],
            _ => 0,
        };
        f.put("award", award);
        f.put("award_count", super::support::award_count(award, n));
        return OpOutput::done("award", f, mentioned);
    }
    let Some(row) = row else {
        return OpOutput::done("none", f, mentioned);
    };
    let others: Vec<String> = table
        .iter()
        .filter(|r| r.rank == row.rank && r.group != gi)
        .map(|r| data.groups[r.group].name.clone())
        .collect();
    medal_facts(data, &row.counts, &mut f);
    f.put("rank", rank_value(row.rank, !others.is_empty()));
    f.put("shared_with", Value::from(others));
    OpOutput::done("answered", f, mentioned)
}
