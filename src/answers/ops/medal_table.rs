//! `medal_table`: who leads the medal table, and the top N.

use super::support::{breakdown, contest_scope, medal_table_of, MedalRow};
use super::*;
use crate::answers::value::Style;
use crate::answers::words;

pub static SPEC: OpSpec = OpSpec {
    name: "medal_table",
    summary: "the medal table leader and the top of the table",
    params: &[
        Param {
            name: "count",
            kind: EntityKind::Count,
            required: false,
        },
        // Optional limits: the table for one sport or one day.
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
        // Ranked by one award: "who has the most golds?", "most seats".
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
                "leader",
                "leader_breakdown",
                "leader_total",
                "leaders_count",
                "top",
                "shown",
                "still_open",
                "scope",
            ],
        ),
        no_data("empty", &["still_open", "scope"]),
    ],
    run,
};

/// How many rows to list when the reader does not say, unless the intent's
/// `settings.rows` says otherwise.
const DEFAULT_ROWS: usize = 3;

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let (keep, scope) = contest_scope(input);
    let mut table = medal_table_of(data, &keep);
    // `order: total` ranks by the number of medals of any colour, for "who
    // has the most medals?"; ties then fall back to the usual order.
    if input.settings.get("order").map(String::as_str) == Some("total") {
        table.sort_by(|a, b| {
            b.total()
                .cmp(&a.total())
                .then(b.counts.cmp(&a.counts))
                .then_with(|| data.groups[a.group].name.cmp(&data.groups[b.group].name))
        });
        for i in 0..table.len() {
            table[i].rank = if i > 0 && table[i].total() == table[i - 1].total() {
                table[i - 1].rank
            } else {
                i as u32 + 1
            };
        }
    }
    if let Some(k) = input
        .text("award")
        .and_then(|a| data.awards().iter().position(|x| x == a))
    {
        // By that award first; the usual order breaks ties. Groups with
        // none of it are not in this table.
        table.retain(|r| r.counts[k] > 0);
        table.sort_by(|a, b| {
            b.counts[k]
                .cmp(&a.counts[k])
                .then(b.counts.cmp(&a.counts))
                .then_with(|| data.groups[a.group].name.cmp(&data.groups[b.group].name))
        });
        for i in 0..table.len() {
            table[i].rank = if i > 0 && table[i].counts[k] == table[i - 1].counts[k] {
                table[i - 1].rank
            } else {
                i as u32 + 1
            };
        }
    }
    let still_open = Value::Int(super::support::awards_still_open(data) as i64);
    let mut f = Facts::new().set("still_open", still_open);
    if let Some(s) = scope {
        f.put("scope", s);
    }
    if table.is_empty() {
        return OpOutput::done("empty", f, vec![]);
    }
    let n = input.rows(DEFAULT_ROWS);
    let leaders: Vec<&MedalRow> = table.iter().filter(|r| r.rank == 1).collect();
    f.put(
        "leader",
        Value::List(
            leaders
                .iter()
                .map(|r| Value::Text(data.groups[r.group].name.clone()))
                .collect(),
        ),
    );
    f.put("leaders_count", Value::Int(leaders.len() as i64));
    // Leaders tied on the total may hold different medals: one breakdown
    // would then be wrong for all but one of them.
    if leaders.iter().all(|r| r.counts == leaders[0].counts) {
        f.put(
            "leader_breakdown",
            breakdown(data, &leaders[0].counts, true),
        );
    }
    let award_k = input
        .text("award")
        .and_then(|a| data.awards().iter().position(|x| x == a));
    f.put(
        "leader_total",
        Value::Int(match award_k {
            Some(k) => leaders[0].counts[k],
            None => leaders[0].total(),
        } as i64),
    );
    // Include every row tied with the last one shown, so a cut never splits
    // a shared rank.
    let cutoff_rank = table
        .get(n.min(table.len()) - 1)
        .map(|r| r.rank)
        .unwrap_or(1);
    let shown: Vec<&MedalRow> = table.iter().filter(|r| r.rank <= cutoff_rank).collect();
    let lines: Vec<Value> = shown
        .iter()
        .map(|r| {
            let b = breakdown(data, &r.counts, true);
            let name = &data.groups[r.group].name;
            Value::Dual {
                text: format!("{}. {name} ({})", r.rank, b.render(Style::Text)),
                spoken: format!(
                    "{}, {name}, with {}",
                    words::ordinal(r.rank as u64),
                    b.render(Style::Spoken)
                ),
            }
        })
        .collect();
    f.put("shown", Value::Int(lines.len() as i64));
    f.put("top", Value::List(lines));
    let mentioned: Vec<EntityRef> = leaders.iter().map(|r| EntityRef::Group(r.group)).collect();
    OpOutput::done("answered", f, mentioned.clone()).about(mentioned)
}
