//! `group_medals`: a team's or delegation's award count and its place in the
//! medal table.

use super::support::{awards_still_open, medal_facts, medal_table, rank_value};
use super::*;

pub static SPEC: OpSpec = OpSpec {
    name: "group_medals",
    summary: "a delegation's medal count and rank",
    params: &[Param {
        name: "group",
        kind: EntityKind::Group,
        required: true,
    }],
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
            ],
        ),
        answered("none", &["name", "still_open"]),
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
        .set("name", data.groups[gi].name.as_str())
        .set("still_open", Value::Int(awards_still_open(data) as i64));
    let table = medal_table(data);
    let Some(row) = table.iter().find(|r| r.group == gi) else {
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
