//! The data format reference (`docs/data.md`) says what the model holds:
//! every field and every allowed value of the model's JSON Schema is in one
//! of its tables and nothing else is, every JSON example parses, every
//! example scenario loads with its batches applied, and every broken
//! example is reported exactly as the reference shows.

use std::collections::{BTreeMap, BTreeSet};
use std::path::Path;

use serde_json::Value;
use tidings::dataset::changes::{self, Batch, Change, Records};
use tidings::dataset::load::FILES;
use tidings::dataset::{self, LoadError};

fn read(name: &str) -> Option<String> {
    std::fs::read_to_string(Path::new(env!("CARGO_MANIFEST_DIR")).join(name)).ok()
}

fn reference() -> String {
    read("docs/data.md").expect("docs/data.md exists")
}

/// A fenced block: the line its text starts on, its info string and text.
struct Block {
    line: usize,
    info: String,
    text: String,
}

fn blocks(markdown: &str) -> Vec<Block> {
    let mut out = Vec::new();
    let mut current: Option<Block> = None;
    for (i, line) in markdown.lines().enumerate() {
        let fence = line.trim_start().strip_prefix("```");
        match (&mut current, fence) {
            (None, Some(info)) => {
                current = Some(Block {
                    line: i + 2,
                    info: info.trim().to_string(),
                    text: String::new(),
                })
            }
            (Some(_), Some(_)) => out.push(current.take().expect("inside a block")),
            (Some(b), None) => {
                b.text.push_str(line);
                b.text.push('\n');
            }
            (None, None) => {}
        }
    }
    assert!(current.is_none(), "docs/data.md has an unclosed code block");
    out
}

/// The first column of the table after each `<!-- KIND: NAME -->` marker,
/// without its backticks: what the reference documents for NAME.
fn tables(markdown: &str, kind: &str) -> BTreeMap<String, BTreeSet<String>> {
    let mut out = BTreeMap::new();
    let lines: Vec<&str> = markdown.lines().collect();
    let open = format!("<!-- {kind}: ");
    for (i, line) in lines.iter().enumerate() {
        let Some(name) = line
            .trim()
            .strip_prefix(&open)
            .and_then(|r| r.strip_suffix("-->"))
        else {
            continue;
        };
        let rows = lines[i + 1..]
            .iter()
            .skip_while(|l| !l.starts_with('|'))
            .take_while(|l| l.starts_with('|'))
            .skip(2);
        let mut names = BTreeSet::new();
        for row in rows {
            let first = row.split('|').nth(1).unwrap_or_default().trim();
            let name = first
                .strip_prefix('`')
                .and_then(|f| f.strip_suffix('`'))
                .unwrap_or_else(|| {
                    panic!("docs/data.md line {}: {first:?} is not `quoted`", i + 1)
                });
            names.insert(name.to_string());
        }
        assert!(
            !names.is_empty(),
            "docs/data.md line {}: no table after the marker",
            i + 1
        );
        let clash = out.insert(name.trim().to_string(), names);
        assert!(clash.is_none(), "docs/data.md documents {name} twice");
    }
    out
}

/// Every string a schema allows as a value (`enum` lists and `const`s).
fn allowed_strings(schema: &Value, out: &mut BTreeSet<String>) {
    let Value::Object(m) = schema else {
        return;
    };
    if let Some(Value::String(c)) = m.get("const") {
        out.insert(c.clone());
    }
    if let Some(Value::Array(e)) = m.get("enum") {
        out.extend(e.iter().filter_map(|v| v.as_str().map(String::from)));
    }
    for key in ["oneOf", "anyOf"] {
        if let Some(Value::Array(vs)) = m.get(key) {
            for v in vs {
                allowed_strings(v, out);
            }
        }
    }
}

fn keys(schema: &Value) -> Option<BTreeSet<String>> {
    schema
        .get("properties")
        .and_then(Value::as_object)
        .map(|p| p.keys().cloned().collect())
}

/// What the model's JSON Schema holds: record fields by type name (a tagged
/// change as `change=<tag>`) and allowed values by type name.
#[derive(Default)]
struct Model {
    fields: BTreeMap<String, BTreeSet<String>>,
    values: BTreeMap<String, BTreeSet<String>>,
}

impl Model {
    fn add(&mut self, name: &str, schema: &Value) {
        if let Some(k) = keys(schema) {
            self.fields.insert(name.to_string(), k);
            return;
        }
        let variants = schema.get("oneOf").and_then(Value::as_array);
        let tagged: Vec<(String, BTreeSet<String>)> = variants
            .into_iter()
            .flatten()
            .filter_map(|v| {
                let k = keys(v)?;
                let tag = v["properties"].as_object()?.iter().find_map(|(field, s)| {
                    let mut tags = BTreeSet::new();
                    allowed_strings(s, &mut tags);
                    (tags.len() == 1).then(|| (field.clone(), tags.pop_first().unwrap()))
                })?;
                Some((format!("{}={}", tag.0, tag.1), k))
            })
            .collect();
        if !tagged.is_empty() {
            let tag_field = tagged[0].0.split('=').next().unwrap().to_string();
            let tags = tagged
                .iter()
                .map(|(t, _)| t.split('=').nth(1).unwrap().to_string())
                .collect();
            self.values.insert(tag_field, tags);
            self.fields.extend(tagged);
            return;
        }
        let mut values = BTreeSet::new();
        allowed_strings(schema, &mut values);
        if !values.is_empty() {
            self.values.insert(name.to_string(), values);
        }
    }

    fn load() -> Model {
        let mut m = Model::default();
        for (root, schema) in [
            ("Records", schemars::schema_for!(Records)),
            ("Batch", schemars::schema_for!(Batch)),
        ] {
            let v = schema.as_value();
            m.add(root, v);
            for (name, def) in v
                .get("$defs")
                .and_then(Value::as_object)
                .into_iter()
                .flatten()
            {
                m.add(name, def);
            }
        }
        m
    }
}

/// Names in backticks anywhere in a text.
fn quoted(text: &str) -> BTreeSet<String> {
    text.split('`')
        .skip(1)
        .step_by(2)
        .map(|s| s.trim_matches('"').to_string())
        .collect()
}

#[test]
fn every_field_and_value_of_the_model_is_documented_and_nothing_else() {
    let doc = reference();
    let documented_fields = tables(&doc, "fields");
    let documented_values = tables(&doc, "values");
    // The fields of league seasons have a reference of their own; a field
    // or value it names counts as documented.
    let elsewhere = read("docs/data-league.md")
        .map(|t| quoted(&t))
        .unwrap_or_default();
    let model = Model::load();
    assert!(model.fields.contains_key("Contest") && model.fields.contains_key("change=results"));
    let mut problems = Vec::new();
    for (kind, have, documented) in [
        ("field", &model.fields, &documented_fields),
        ("value", &model.values, &documented_values),
    ] {
        for (name, items) in have {
            let said = documented.get(name).cloned().unwrap_or_default();
            for item in items.difference(&said) {
                if !elsewhere.contains(item) {
                    problems.push(format!("{name}: {kind} `{item}` is not documented"));
                }
            }
            for item in said.difference(items) {
                problems.push(format!(
                    "{name}: `{item}` is documented but the model has no such {kind}"
                ));
            }
        }
        for name in documented.keys().filter(|n| !have.contains_key(*n)) {
            problems.push(format!(
                "docs/data.md documents {name}, which the model does not have"
            ));
        }
    }
    assert!(
        problems.is_empty(),
        "docs/data.md:\n{}",
        problems.join("\n")
    );
}

#[test]
fn the_field_check_would_notice_a_missing_field() {
    // The comparison above is only worth something if a table that leaves
    // a field out is caught: drop one row and the difference shows.
    let doc = reference().replace("| `venue` | string | none | Where the contest", "");
    let documented = tables(&doc, "fields");
    let model = Model::load();
    assert!(model.fields["Contest"].contains("venue"));
    assert!(!documented["Contest"].contains("venue"));
}

/// An example scenario's files: file name → (line, text).
type Files = BTreeMap<String, (usize, String)>;

/// Parses a fragment labelled with the kind of record it shows.
fn parse_fragment(label: &str, text: &str) -> Result<(), String> {
    fn p<T: serde::de::DeserializeOwned>(t: &str) -> Result<(), String> {
        serde_json::from_str::<T>(t)
            .map(|_| ())
            .map_err(|e| e.to_string())
    }
    match label {
        "scenario" => p::<dataset::Scenario>(text),
        "sport" => p::<dataset::Sport>(text),
        "discipline" => p::<dataset::Discipline>(text),
        "group" => p::<dataset::Group>(text),
        "competitor" => p::<dataset::Competitor>(text),
        "contest" => p::<dataset::Contest>(text),
        "entry" => p::<dataset::Entry>(text),
        "change" => p::<Change>(text),
        "batch" => p::<Batch>(text),
        "records" => p::<Records>(text),
        other => Err(format!("unknown label {other:?}")),
    }
}

#[test]
fn every_json_example_parses_and_every_example_scenario_loads() {
    let doc = reference();
    let all = blocks(&doc);
    // Scenario name → file → (line, text), in the reference's order.
    let mut scenarios: Vec<(String, Files)> = Vec::new();
    let mut batches: Vec<(String, usize, String)> = Vec::new();
    let mut checks: BTreeMap<String, (usize, String)> = BTreeMap::new();
    for b in &all {
        let mut words = b.info.split_whitespace();
        match (words.next(), words.next()) {
            (Some("json"), None) => panic!(
                "docs/data.md line {}: a JSON example needs a label (a record kind, or scenario/file)",
                b.line
            ),
            (Some("json"), Some(label)) => match label.split_once('/') {
                None => {
                    if let Err(e) = parse_fragment(label, &b.text) {
                        panic!("docs/data.md line {}: the {label} example: {e}", b.line);
                    }
                }
                Some((name, "batch")) => batches.push((name.into(), b.line, b.text.clone())),
                Some((name, file)) => {
                    assert!(
                        FILES.contains(&file),
                        "docs/data.md line {}: {file} is not a scenario file",
                        b.line
                    );
                    let at = match scenarios.iter().position(|(n, _)| n == name) {
                        Some(i) => i,
                        None => {
                            scenarios.push((name.to_string(), BTreeMap::new()));
                            scenarios.len() - 1
                        }
                    };
                    scenarios[at]
                        .1
                        .insert(file.to_string(), (b.line, b.text.clone()));
                }
            },
            (Some("text"), Some("check")) => {
                let name = words.next().expect("`text check NAME`");
                checks.insert(name.to_string(), (b.line, b.text.clone()));
            }
            _ => {}
        }
    }
    let complete = scenarios
        .iter()
        .find(|(n, _)| !n.starts_with("broken"))
        .map(|(_, files)| files.clone())
        .expect("the reference has a complete example");
    let mut loaded = 0;
    for (name, files) in &scenarios {
        let broken = name.starts_with("broken");
        let text_of = |file: &str| -> Option<String> {
            files
                .get(file)
                .or_else(|| broken.then(|| complete.get(file)).flatten())
                .map(|(_, t)| t.clone())
        };
        let result = dataset::load_files(&|file: &str| {
            text_of(file)
                .map(|t| (format!("{name}/{file}"), t))
                .ok_or_else(|| LoadError::File(format!("the example {name} has no {file}")))
        });
        if broken {
            let (line, want) = checks.get(name).unwrap_or_else(|| {
                panic!("the broken example {name} shows no `text check {name}` output")
            });
            let got = match result {
                Ok(_) => panic!("the broken example {name} loads"),
                Err(LoadError::Invalid(p)) => {
                    p.iter().map(|p| format!("{p}\n")).collect::<String>()
                }
                Err(e) => e.to_string(),
            };
            assert_eq!(
                got, *want,
                "docs/data.md line {line}: the output shown for {name} is not what the check says"
            );
            continue;
        }
        let mut data =
            result.unwrap_or_else(|e| panic!("the example scenario {name} does not load:\n{e}"));
        loaded += 1;
        for (_, line, text) in batches.iter().filter(|(n, _, _)| n == name) {
            let batch = changes::parse(text).unwrap_or_else(|p| {
                panic!("docs/data.md line {line}: the batch does not parse: {p:?}")
            });
            let now = data.as_of.to_string();
            data = changes::apply(&data, &batch, &now).unwrap_or_else(|p| {
                let list: Vec<String> = p.iter().map(|p| p.to_string()).collect();
                panic!(
                    "docs/data.md line {line}: the batch is refused:\n{}",
                    list.join("\n")
                )
            });
        }
    }
    assert!(
        loaded >= 3,
        "the reference loads a games, an election and a league"
    );
    for (name, _, _) in &batches {
        assert!(
            scenarios.iter().any(|(n, _)| n == name),
            "a batch for {name}, which the reference does not define"
        );
    }
    for name in checks.keys() {
        assert!(
            scenarios.iter().any(|(n, _)| n == name),
            "check output for {name}, which the reference does not define"
        );
    }
}
