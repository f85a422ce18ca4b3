//! `day_schedule`: what is on for a day, optionally for one sport. Times are
//! given in the scenario's time zone.

use super::support::when_value;
use super::*;

pub static SPEC: OpSpec = OpSpec {
    name: "day_schedule",
    summary: "what is on for a day",
    params: &[
        Param {
            name: "date",
            kind: EntityKind::Date,
            required: false,
        },
        Param {
            name: "sport",
            kind: EntityKind::Sport,
            required: false,
        },
    ],
    outcomes: &[
        answered("answered", &["day", "items", "count", "sport_name"]),
        no_data("nothing_on", &["day", "sport_name"]),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let now = input.now;
    let day = match input.slots.get("date") {
        Some(SlotValue::Date { value }) => *value,
        _ => now.date(),
    };
    let sport = match input.entity("sport") {
        Some(EntityRef::Sport(s)) => Some(s),
        _ => None,
    };
    let mut f = Facts::new().set("day", super::support::day_value(day, now));
    if let Some(s) = sport {
        f.put("sport_name", data.sports[s].name.as_str());
    }
    let mut on: Vec<usize> = (0..data.contests.len())
        .filter(|&c| data.facts[c].start.date() == day)
        .filter(|&c| sport.is_none_or(|s| data.sport(&data.contests[c].sport) == Some(s)))
        .collect();
    on.sort_by_key(|&c| data.facts[c].start.timestamp());
    if on.is_empty() {
        return OpOutput::done("nothing_on", f, vec![]);
    }
    let items: Vec<Value> = on
        .iter()
        .map(|&c| {
            let start = &data.facts[c].start;
            let name = data.contest_name(c);
            let spoken = when_value(start, now).render(crate::answers::value::Style::Spoken);
            // Spoken: "the women's long jump final at nineteen forty".
            let clock = spoken.rsplit(" at ").next().unwrap_or("").to_string();
            Value::Dual {
                text: format!("{:02}:{:02} {name}", start.hour(), start.minute()),
                spoken: format!("the {name} at {clock}"),
            }
        })
        .collect();
    f.put("count", Value::Int(items.len() as i64));
    f.put("items", Value::List(items));
    OpOutput::done(
        "answered",
        f,
        on.into_iter().map(EntityRef::Contest).collect(),
    )
}
