//! `about`: what the data say about a competitor as such: their team,
//! delegation or party, their sport and category, and the contests they
//! are entered in ("which party is she standing for?", "what sport does he
//! do?", "where is she from?").

use super::*;

pub static SPEC: OpSpec = OpSpec {
    name: "about",
    summary: "a competitor's group, sport and contests",
    params: &[Param {
        name: "competitor",
        kind: EntityKind::Competitor,
        required: true,
    }],
    outcomes: &[answered(
        "answered",
        &[
            "name",
            "group",
            "sport",
            "noun",
            "category",
            "contests",
            "contest_count",
        ],
    )],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let Some(pi) = input.competitor("competitor") else {
        return OpOutput::Choose {
            slot: "competitor",
            options: vec![],
        };
    };
    let c = &data.competitors[pi];
    let who = EntityRef::Competitor(pi);
    let mut f = Facts::new().set("name", c.name());
    let mut mentioned = vec![who];
    if let Some(g) = data.group(&c.group) {
        f.put("group", data.groups[g].name.as_str());
        mentioned.push(EntityRef::Group(g));
    }
    if let Some(s) = data.sport(&c.sport) {
        f.put("sport", data.sports[s].name.as_str());
        f.put("noun", data.sports[s].noun.as_str());
    }
    if let Some(cat) = &c.category {
        f.put("category", cat.as_str());
    }
    let contests: Vec<Value> = data
        .contests_of(pi)
        .iter()
        .map(|(ci, _)| {
            // "the men's 100 m final", but a contest named like a place is
            // a proper name: "Marrowby".
            let n = data.contest_name(*ci);
            Value::Text(if n.starts_with(char::is_uppercase) {
                n
            } else {
                format!("the {n}")
            })
        })
        .collect();
    f.put("contest_count", Value::Int(contests.len() as i64));
    f.put("contests", Value::List(contests));
    OpOutput::done("answered", f, mentioned).about(vec![who])
}
