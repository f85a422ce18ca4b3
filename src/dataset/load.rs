//! Reading a scenario folder and checking it before anything is served.
//!
//! A scenario is a folder of JSON files: `scenario.json` (one object) and
//! `sports.json`, `groups.json`, `competitors.json`, `contests.json` (arrays).
//! Every problem is collected, not just the first, so an editor can fix a file
//! in one pass; each names the file, the record and the field, and stands at
//! the `line:column` of the value at fault (`locate`).

use std::collections::{HashMap, HashSet};
use std::fmt;
use std::path::{Path, PathBuf};

use jiff::{civil::DateTime, tz::TimeZone, Timestamp};
use serde::de::DeserializeOwned;

use super::locate::{line_col, offset_of, Spans};
use super::mark;
use super::model::*;
use super::{ContestFacts, Dataset};

/// One thing wrong with the data.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub struct DataProblem {
    /// The file, relative to what the caller gave; once located, as the
    /// caller named it.
    pub file: String,
    /// The record's id, or its position when it has none.
    pub record: String,
    /// The field at fault.
    pub field: String,
    /// Where the field stands in its file, as a JSON pointer (RFC 6901):
    /// `/3/entries/1/award`. A field that is absent is found at its record.
    pub pointer: String,
    /// Line and column (1-based, in characters) of `pointer` in the file,
    /// once the problem is located in the file's text.
    pub line: Option<usize>,
    pub column: Option<usize>,
    pub message: String,
}

impl DataProblem {
    /// A problem not yet located in any text.
    pub fn new(file: &str, record: &str, field: &str, pointer: String, message: String) -> Self {
        DataProblem {
            file: file.to_string(),
            record: record.to_string(),
            field: field.to_string(),
            pointer,
            line: None,
            column: None,
            message,
        }
    }

    /// Finds the problem's pointer in `text` (the file it names, parsed as
    /// `spans`) and reports it under `name`.
    pub fn locate(&mut self, name: &str, text: &str, spans: &Spans) {
        let (line, column) = line_col(text, spans.find(&self.pointer).start);
        self.file = name.to_string();
        self.line = Some(line);
        self.column = Some(column);
    }
}

impl fmt::Display for DataProblem {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{}", self.file)?;
        if let (Some(l), Some(c)) = (self.line, self.column) {
            write!(f, ":{l}:{c}")?;
        }
        if !self.record.is_empty() {
            write!(f, ": record {}", self.record)?;
        }
        if !self.field.is_empty() {
            write!(f, ": field {}", self.field)?;
        }
        write!(f, ": {}", self.message)
    }
}

/// Why a scenario could not be loaded.
#[derive(Debug, thiserror::Error)]
pub enum LoadError {
    /// A file could not be read or parsed; syntax errors carry line:column.
    #[error("{0}")]
    File(String),
    /// The files parsed but do not agree with each other.
    #[error("{} problem(s) in the data:\n{}", .0.len(), list(.0))]
    Invalid(Vec<DataProblem>),
}

fn list(p: &[DataProblem]) -> String {
    p.iter()
        .map(|p| format!("  {p}"))
        .collect::<Vec<_>>()
        .join("\n")
}

/// The files a scenario is made of.
pub const FILES: [&str; 5] = [
    "scenario.json",
    "sports.json",
    "groups.json",
    "competitors.json",
    "contests.json",
];

/// Reads and validates the scenario in `dir`.
pub fn load_dir(dir: &Path) -> Result<Dataset, LoadError> {
    load_files(&|name: &str| {
        let path: PathBuf = dir.join(name);
        std::fs::read_to_string(&path)
            .map(|text| (path.display().to_string(), text))
            .map_err(|e| LoadError::File(format!("{}: cannot read: {e}", path.display())))
    })
}

/// Gives the reported name and the text of one scenario file.
pub type FileSource<'a> = dyn Fn(&str) -> Result<(String, String), LoadError> + 'a;

/// Reads and validates a scenario from any source of file texts; `read`
/// returns the name to report and the text of one of [`FILES`].
///
/// Each file is parsed on its own, so a broken file does not hide the
/// problems of the others, and each record of a file on its own, so every
/// record that does not fit the model is reported. The records are checked
/// against each other only when they all parse (a record that did not
/// parse would make the rest look wrong). Every problem is located at its
/// file's line and column.
pub fn load_files(read: &FileSource) -> Result<Dataset, LoadError> {
    let mut texts = Vec::with_capacity(FILES.len());
    for name in FILES {
        texts.push(read(name)?);
    }
    let mut p = Vec::new();
    let of = |i: usize| (texts[i].0.as_str(), texts[i].1.as_str());
    let scenario = parse_file::<Scenario>(of(0), &mut p, |name, text, spans, p| {
        record(name, text, spans, "", p)
    });
    let sports = parse_file(of(1), &mut p, |name, text, spans, p| {
        records::<Sport>(name, text, Some(spans), p)
    });
    let groups = parse_file(of(2), &mut p, |name, text, spans, p| {
        records::<Group>(name, text, Some(spans), p)
    });
    let competitors = parse_file(of(3), &mut p, |name, text, spans, p| {
        records::<Competitor>(name, text, Some(spans), p)
    });
    let contests = parse_file(of(4), &mut p, |name, text, spans, p| {
        records::<Contest>(name, text, Some(spans), p)
    });
    let (Some(scenario), Some(sports), Some(groups), Some(competitors), Some(contests)) =
        (scenario, sports, groups, competitors, contests)
    else {
        return Err(LoadError::Invalid(p));
    };
    build(scenario, sports, groups, competitors, contests, 1).map_err(|e| match e {
        LoadError::Invalid(mut problems) => {
            // Where values stand is worked out only now that it is needed.
            let spans: Vec<Option<Spans>> = texts.iter().map(|(_, t)| Spans::scan(t)).collect();
            for problem in &mut problems {
                if let Some(i) = FILES.iter().position(|f| *f == problem.file) {
                    if let Some(s) = &spans[i] {
                        problem.locate(&texts[i].0, &texts[i].1, s);
                    }
                }
            }
            // In the order an editor reads the files: file by file, top down.
            problems.sort_by_key(|p| {
                let file = texts.iter().position(|(name, _)| *name == p.file);
                (file, p.line, p.column)
            });
            LoadError::Invalid(problems)
        }
        other => other,
    })
}

/// One file's records: read whole when they fit (the usual case, one pass),
/// else read again piece by piece by `each` over the file's spans, so that
/// every problem is found and placed.
fn parse_file<T: DeserializeOwned>(
    (name, text): (&str, &str),
    p: &mut Vec<DataProblem>,
    each: impl Fn(&str, &str, &Spans, &mut Vec<DataProblem>) -> Option<T>,
) -> Option<T> {
    if let Ok(v) = serde_json::from_str(text) {
        return Some(v);
    }
    let spans = syntax(name, text, p)?;
    let before = p.len();
    let v = each(name, text, &spans, p);
    if v.is_some() || p.len() == before {
        // serde refused the whole but no piece: say what serde said.
        if let Err(e) = serde_json::from_str::<T>(text) {
            p.push(serde_problem(name, text, Some(&spans), "", &e));
        }
        return None;
    }
    v
}

/// Checks that `text` is one JSON value; its spans, or a problem at the
/// place serde stopped.
pub fn syntax(name: &str, text: &str, p: &mut Vec<DataProblem>) -> Option<Spans> {
    if let Err(e) = serde_json::from_str::<serde::de::IgnoredAny>(text) {
        p.push(serde_problem(name, text, None, "", &e));
        return None;
    }
    let spans = Spans::scan(text);
    if spans.is_none() {
        // serde accepted the text, so the scanner should too.
        p.push(DataProblem::new(
            name,
            "",
            "",
            String::new(),
            "cannot read this JSON".into(),
        ));
    }
    spans
}

/// Every record of an array file, each parsed from its own part of the
/// text; `None` when the file is not an array or any record does not fit.
pub fn records<T: DeserializeOwned>(
    name: &str,
    text: &str,
    spans: Option<&Spans>,
    p: &mut Vec<DataProblem>,
) -> Option<Vec<T>> {
    let spans = spans?;
    let Some(items) = spans.items() else {
        let mut problem = DataProblem::new(
            name,
            "",
            "",
            String::new(),
            "expected an array of records: [ {...}, {...} ]".into(),
        );
        problem.locate(name, text, spans);
        p.push(problem);
        return None;
    };
    let before = p.len();
    let out: Vec<T> = items
        .iter()
        .enumerate()
        .filter_map(|(i, item)| record(name, text, item, &record_name(text, item, i), p))
        .collect();
    (p.len() == before).then_some(out)
}

/// One record, parsed from its span of the text; a problem at serde's
/// position otherwise.
pub fn record<T: DeserializeOwned>(
    name: &str,
    text: &str,
    item: &Spans,
    record: &str,
    p: &mut Vec<DataProblem>,
) -> Option<T> {
    match serde_json::from_str(&text[item.start..item.end]) {
        Ok(v) => Some(v),
        Err(e) => {
            p.push(serde_problem(name, text, Some(item), record, &e));
            None
        }
    }
}

/// How a record is named in a problem: its id when it has a string one,
/// else its position (`#3`).
pub fn record_name(text: &str, item: &Spans, i: usize) -> String {
    item.member("id")
        .and_then(|id| serde_json::from_str::<String>(&text[id.start..id.end]).ok())
        .filter(|id| !id.trim().is_empty())
        .unwrap_or_else(|| format!("#{}", i + 1))
}

/// Where a problem serde found in a record is best shown: an unknown field
/// at its name, an unknown value at the value, a missing field at its
/// object, a value of the wrong type where it starts. serde's own position
/// is after the fact (past the name, the value or the whole object).
fn refine(spans: &Spans, text: &str, at: usize, message: &str) -> usize {
    let quoted = |prefix: &str| {
        message
            .strip_prefix(prefix)
            .and_then(|rest| rest.split('`').next())
    };
    let better = if let Some(name) = quoted("unknown field `") {
        spans.key_nearest(name, at)
    } else if let Some(value) = quoted("unknown variant `") {
        spans.string_nearest(text, value, at)
    } else if message.starts_with("missing field `") {
        spans.object_at(at.saturating_sub(1))
    } else {
        spans.scalar_at(at)
    };
    better.unwrap_or(at)
}

/// A serde error in the part of `text` that `within` spans (the whole text
/// when `None`), located in the whole text.
pub fn serde_problem(
    name: &str,
    text: &str,
    within: Option<&Spans>,
    record: &str,
    e: &serde_json::Error,
) -> DataProblem {
    let full = e.to_string();
    let mut message = full
        .strip_suffix(&format!(" at line {} column {}", e.line(), e.column()))
        .unwrap_or(&full)
        .to_string();
    // serde names the Rust types it expected; an editor knows JSON's.
    for (rust, json) in [
        ("expected u32", "expected a whole number"),
        ("expected f64", "expected a number"),
        ("expected a sequence", "expected a list [...]"),
        ("expected a boolean", "expected true or false"),
    ] {
        if let Some(rest) = message.strip_suffix(rust) {
            message = format!("{rest}{json}");
        }
    }
    if let Some((rest, _)) = message.split_once("expected struct ") {
        message = format!("{rest}expected an object {{...}}");
    }
    let base = within.map_or(0, |s| s.start);
    let part = &text[base..];
    let mut at = base + offset_of(part, e.line(), e.column());
    if let (true, Some(spans)) = (e.is_data(), within) {
        at = refine(spans, text, at, &message);
    }
    let (line, column) = line_col(text, at);
    DataProblem {
        file: name.to_string(),
        record: record.to_string(),
        field: String::new(),
        pointer: String::new(),
        line: Some(line),
        column: Some(column),
        message,
    }
}

struct Problems(Vec<DataProblem>);

impl Problems {
    /// A problem with `field` of `record`; `pointer` is the field's place
    /// in its file.
    fn add(
        &mut self,
        file: &str,
        record: &str,
        field: &str,
        pointer: String,
        message: impl Into<String>,
    ) {
        self.0.push(DataProblem::new(
            file,
            record,
            field,
            pointer,
            message.into(),
        ));
    }
}

fn index<T>(
    items: &[T],
    id: impl Fn(&T) -> &str,
    file: &str,
    p: &mut Problems,
) -> HashMap<Id, usize> {
    let mut ix = HashMap::new();
    for (i, item) in items.iter().enumerate() {
        let key = id(item);
        if key.trim().is_empty() {
            p.add(
                file,
                &format!("#{}", i + 1),
                "id",
                format!("/{i}/id"),
                "id is empty",
            );
        } else if ix.insert(key.to_string(), i).is_some() {
            p.add(file, key, "id", format!("/{i}/id"), "duplicate id");
        }
    }
    ix
}

/// Checks and indexes already-parsed records.
pub fn build(
    scenario: Scenario,
    sports: Vec<Sport>,
    groups: Vec<Group>,
    competitors: Vec<Competitor>,
    mut contests: Vec<Contest>,
    version: u64,
) -> Result<Dataset, LoadError> {
    super::sides::fill_places(&mut contests);
    let mut p = Problems(Vec::new());
    let sf = "scenario.json";
    let tz = match TimeZone::get(&scenario.time_zone) {
        Ok(tz) => tz,
        Err(_) => {
            p.add(
                sf,
                &scenario.id,
                "time_zone",
                "/time_zone".into(),
                format!("unknown time zone {:?}", scenario.time_zone),
            );
            TimeZone::UTC
        }
    };
    let as_of = match scenario.as_of.parse::<Timestamp>() {
        Ok(t) => t,
        Err(_) => {
            p.add(
                sf,
                &scenario.id,
                "as_of",
                "/as_of".into(),
                "expected an RFC 3339 time with offset",
            );
            Timestamp::UNIX_EPOCH
        }
    };
    let clock = match scenario.clock.as_deref().map(str::parse::<Timestamp>) {
        None => None,
        Some(Ok(t)) => Some(t),
        Some(Err(_)) => {
            p.add(
                sf,
                &scenario.id,
                "clock",
                "/clock".into(),
                "expected an RFC 3339 time with offset",
            );
            None
        }
    };
    let mut seen = HashSet::new();
    for (k, a) in scenario.awards.iter().enumerate() {
        if !seen.insert(a) {
            p.add(
                sf,
                &scenario.id,
                "awards",
                format!("/awards/{k}"),
                format!("award {a:?} listed twice"),
            );
        }
    }

    for (rec, field, msg) in super::table::check_rules(&scenario, &sports) {
        // The table by its id, or "tables #n" for one without.
        let k = scenario
            .tables
            .iter()
            .position(|t| t.id == rec)
            .or_else(|| {
                rec.strip_prefix("tables #")
                    .and_then(|n| n.parse::<usize>().ok())
                    .map(|n| n - 1)
            });
        let at = match k {
            Some(k) => format!("/tables/{k}/{field}"),
            None => "/tables".to_string(),
        };
        p.add(sf, &rec, &field, at, msg);
    }

    let sport_ix = index(&sports, |s| &s.id, "sports.json", &mut p);
    for (i, s) in sports.iter().enumerate() {
        let mut ds = HashSet::new();
        for (k, d) in s.disciplines.iter().enumerate() {
            if !ds.insert(&d.id) {
                p.add(
                    "sports.json",
                    &s.id,
                    "disciplines",
                    format!("/{i}/disciplines/{k}/id"),
                    format!("duplicate discipline id {:?}", d.id),
                );
            }
        }
    }
    let group_ix = index(&groups, |g| &g.id, "groups.json", &mut p);
    let competitor_ix = index(&competitors, |c| &c.id, "competitors.json", &mut p);
    let contest_ix = index(&contests, |c| &c.id, "contests.json", &mut p);

    for (i, c) in competitors.iter().enumerate() {
        let f = "competitors.json";
        if !group_ix.contains_key(&c.group) {
            p.add(
                f,
                &c.id,
                "group",
                format!("/{i}/group"),
                format!("no group with id {:?}", c.group),
            );
        }
        if !sport_ix.contains_key(&c.sport) {
            p.add(
                f,
                &c.id,
                "sport",
                format!("/{i}/sport"),
                format!("no sport with id {:?}", c.sport),
            );
        }
        if c.given.trim().is_empty() && c.family.trim().is_empty() {
            p.add(
                f,
                &c.id,
                "family",
                format!("/{i}/family"),
                "a competitor needs a name",
            );
        }
    }

    check_alias_clashes(&groups, &competitors, &mut p);

    let mut facts = Vec::with_capacity(contests.len());
    for (ci, c) in contests.iter().enumerate() {
        facts.push(check_contest(
            c,
            ci,
            &scenario,
            &tz,
            &sports,
            &sport_ix,
            &group_ix,
            &competitor_ix,
            &competitors,
            &mut p,
        ));
    }

    if !p.0.is_empty() {
        return Err(LoadError::Invalid(p.0));
    }
    for (ci, f) in facts.iter_mut().enumerate() {
        f.name = super::sides::contest_name(&contests, &sports, &groups, &competitors, ci)
            .unwrap_or_else(|| contest_name(&contests, &sports, &sport_ix, ci));
    }
    let mut entries_of = vec![Vec::new(); competitors.len()];
    for (ci, c) in contests.iter().enumerate() {
        for (ei, e) in c.entries.iter().enumerate() {
            for id in e.competitor.iter().chain(&e.members) {
                if let Some(&pi) = competitor_ix.get(id) {
                    entries_of[pi].push((ci, ei));
                }
            }
        }
    }
    let mut data = Dataset {
        scenario,
        sports,
        groups,
        competitors,
        contests,
        facts,
        tz,
        as_of,
        clock,
        version,
        sport_ix,
        group_ix,
        competitor_ix,
        contest_ix,
        entries_of,
        tables: Vec::new(),
    };
    data.tables = super::table::compute_all(&data);
    Ok(data)
}

/// "women's long jump", with the phase added when it is not the final or
/// when the same event has other phases ("men's 100 m final", "heat 1").
fn contest_name(
    contests: &[Contest],
    sports: &[Sport],
    sport_ix: &HashMap<Id, usize>,
    ci: usize,
) -> String {
    let c = &contests[ci];
    let mut out = String::new();
    match c.category.as_deref() {
        Some("women") => out.push_str("women's "),
        Some("men") => out.push_str("men's "),
        Some(other) => {
            out.push_str(other);
            out.push(' ');
        }
        None => {}
    }
    let discipline = sport_ix
        .get(&c.sport)
        .and_then(|&s| sports[s].disciplines.iter().find(|d| d.id == c.discipline))
        .map(|d| d.name.as_str())
        .unwrap_or(&c.discipline);
    out.push_str(discipline);
    let other_phases = contests.iter().any(|o| {
        o.id != c.id
            && o.sport == c.sport
            && o.discipline == c.discipline
            && o.category == c.category
    });
    if c.phase != "final" || other_phases {
        out.push(' ');
        out.push_str(&c.phase);
    }
    out
}

/// A name that means a group must not also mean a person, and the other
/// way round: a competitor's alias equal to a delegation's name (or code or
/// alias) would send questions about the delegation to the person. Names
/// are compared in their matching form (`understand::normalize`).
fn check_alias_clashes(groups: &[Group], competitors: &[Competitor], p: &mut Problems) {
    use crate::understand::normalize::normalize;
    let mut group_names: HashMap<String, &str> = HashMap::new();
    for g in groups {
        for n in std::iter::once(&g.name)
            .chain(&g.aliases)
            .chain(g.code.as_ref())
        {
            group_names.entry(normalize(n)).or_insert(&g.id);
        }
    }
    let mut people: HashMap<String, &str> = HashMap::new();
    for (i, c) in competitors.iter().enumerate() {
        people
            .entry(normalize(&format!("{} {}", c.given, c.family)))
            .or_insert(&c.id);
        for (k, a) in c.aliases.iter().enumerate() {
            if let Some(g) = group_names.get(&normalize(a)) {
                p.add(
                    "competitors.json",
                    &c.id,
                    "aliases",
                    format!("/{i}/aliases/{k}"),
                    format!(
                        "alias {a:?} is also a name of group {g:?}: a name must mean one thing"
                    ),
                );
            }
        }
    }
    for (i, g) in groups.iter().enumerate() {
        for (k, a) in g.aliases.iter().enumerate() {
            if let Some(c) = people.get(&normalize(a)) {
                p.add(
                    "groups.json",
                    &g.id,
                    "aliases",
                    format!("/{i}/aliases/{k}"),
                    format!("alias {a:?} is also the name of competitor {c:?}: a name must mean one thing"),
                );
            }
        }
    }
}

#[allow(clippy::too_many_arguments)]
fn check_contest(
    c: &Contest,
    ci: usize,
    scenario: &Scenario,
    tz: &TimeZone,
    sports: &[Sport],
    sport_ix: &HashMap<Id, usize>,
    group_ix: &HashMap<Id, usize>,
    competitor_ix: &HashMap<Id, usize>,
    competitors: &[Competitor],
    p: &mut Problems,
) -> ContestFacts {
    let f = "contests.json";
    let at = |field: &str| format!("/{ci}/{field}");
    match sport_ix.get(&c.sport) {
        None => p.add(
            f,
            &c.id,
            "sport",
            at("sport"),
            format!("no sport with id {:?}", c.sport),
        ),
        Some(&s) => {
            if !sports[s].disciplines.iter().any(|d| d.id == c.discipline) {
                p.add(
                    f,
                    &c.id,
                    "discipline",
                    at("discipline"),
                    format!("sport {:?} has no discipline {:?}", c.sport, c.discipline),
                );
            }
        }
    }
    let start = match c
        .start
        .parse::<DateTime>()
        .map(|dt| dt.to_zoned_datetime(tz.clone()))
    {
        Ok(Ok(z)) => z,
        _ => {
            p.add(
                f,
                &c.id,
                "start",
                at("start"),
                format!(
                    "expected a local time such as 2027-08-14T19:40, got {:?}",
                    c.start
                ),
            );
            Timestamp::UNIX_EPOCH.to_zoned_datetime(tz.clone())
        }
    };
    let updated = match c.updated.as_deref().map(str::parse::<Timestamp>) {
        None => None,
        Some(Ok(t)) => Some(t),
        Some(Err(_)) => {
            p.add(
                f,
                &c.id,
                "updated",
                at("updated"),
                "expected an RFC 3339 time with offset",
            );
            None
        }
    };
    if let Some(share) = c.counted {
        if !(0.0..=1.0).contains(&share) {
            p.add(
                f,
                &c.id,
                "counted",
                at("counted"),
                "expected a share between 0 and 1",
            );
        }
    }
    let better = c.better.unwrap_or(c.measure.default_better());
    let mut marks = Vec::with_capacity(c.entries.len());
    let mut seen = HashSet::new();
    for (i, e) in c.entries.iter().enumerate() {
        let rec = format!("{} entry {}", c.id, i + 1);
        let at = |field: &str| format!("/{ci}/entries/{i}/{field}");
        match (&e.competitor, &e.group) {
            (Some(_), Some(_)) => p.add(
                f,
                &rec,
                "competitor",
                at("competitor"),
                "an entry names a competitor or a group, not both",
            ),
            (None, None) => p.add(
                f,
                &rec,
                "competitor",
                at("competitor"),
                "an entry needs a competitor or a group",
            ),
            _ => {}
        }
        if let Some(id) = &e.competitor {
            match competitor_ix.get(id) {
                None => p.add(
                    f,
                    &rec,
                    "competitor",
                    at("competitor"),
                    format!("no competitor with id {id:?}"),
                ),
                Some(&ci) => {
                    let who = &competitors[ci];
                    if who.sport != c.sport {
                        p.add(
                            f,
                            &rec,
                            "competitor",
                            at("competitor"),
                            format!("{id} competes in {}, not {}", who.sport, c.sport),
                        );
                    }
                    if let (Some(a), Some(b)) = (&who.category, &c.category) {
                        if a != b && b != "mixed" {
                            p.add(
                                f,
                                &rec,
                                "competitor",
                                at("competitor"),
                                format!("{id} is in category {a}, the contest is {b}"),
                            );
                        }
                    }
                }
            }
            if !seen.insert(id.clone()) {
                p.add(
                    f,
                    &rec,
                    "competitor",
                    at("competitor"),
                    format!("{id} is entered twice"),
                );
            }
        }
        if let Some(id) = &e.group {
            if !group_ix.contains_key(id) {
                p.add(
                    f,
                    &rec,
                    "group",
                    at("group"),
                    format!("no group with id {id:?}"),
                );
            }
            if !seen.insert(format!("group:{id}")) {
                p.add(
                    f,
                    &rec,
                    "group",
                    at("group"),
                    format!("{id} is entered twice"),
                );
            }
        }
        for (k, m) in e.members.iter().enumerate() {
            if !competitor_ix.contains_key(m) {
                p.add(
                    f,
                    &rec,
                    "members",
                    at(&format!("members/{k}")),
                    format!("no competitor with id {m:?}"),
                );
            }
        }
        let mark = match &e.mark {
            None => None,
            Some(text) => match mark::parse(c.measure, text) {
                Ok(m) => Some(m),
                Err(err) => {
                    p.add(f, &rec, "mark", at("mark"), err.to_string());
                    None
                }
            },
        };
        marks.push(mark);
        if e.status != EntryStatus::Ok && e.place.is_some() {
            p.add(
                f,
                &rec,
                "place",
                at("place"),
                format!("an entry with status {:?} has no place", e.status),
            );
        }
        if let Some(a) = &e.award {
            if !scenario.awards.contains(a) {
                p.add(
                    f,
                    &rec,
                    "award",
                    at("award"),
                    format!("unknown award {a:?}"),
                );
            }
        }
    }
    for (rec, field, msg) in super::sides::check(c) {
        p.add(f, &rec, field, at(field), msg);
    }
    check_places(c, ci, &marks, better, scenario, p);
    ContestFacts {
        start,
        better,
        marks,
        updated,
        // Filled in once every contest has been checked.
        name: String::new(),
    }
}

/// Places must follow standard competition ranking (1, 2, 2, 4), agree with
/// the marks, and awards must follow places in a final contest.
fn check_places(
    c: &Contest,
    ci: usize,
    marks: &[Option<mark::Mark>],
    better: Better,
    scenario: &Scenario,
    p: &mut Problems,
) {
    let f = "contests.json";
    let mut placed: Vec<(u32, usize)> = c
        .entries
        .iter()
        .enumerate()
        .filter_map(|(i, e)| e.place.map(|pl| (pl, i)))
        .collect();
    placed.sort();
    for (k, &(place, i)) in placed.iter().enumerate() {
        let rec = format!("{} entry {}", c.id, i + 1);
        let at = |field: &str| format!("/{ci}/entries/{i}/{field}");
        // Standard competition ranking: a place equals one plus the number of
        // entries placed strictly ahead of it.
        let ahead = placed.iter().filter(|(q, _)| *q < place).count() as u32;
        if place != ahead + 1 {
            p.add(
                f,
                &rec,
                "place",
                at("place"),
                format!(
                    "place {place} does not follow the places before it (expected {})",
                    ahead + 1
                ),
            );
        }
        if k > 0 {
            let (prev_place, j) = placed[k - 1];
            if let (Some(a), Some(b)) = (&marks[j], &marks[i]) {
                let ord = mark::compare(better == Better::Lower, a, b);
                if prev_place == place && ord != std::cmp::Ordering::Equal {
                    p.add(
                        f,
                        &rec,
                        "mark",
                        at("mark"),
                        format!("shares place {place} but its mark differs"),
                    );
                }
                // Equal marks may be placed apart: a tie broken by a photo,
                // a countback or (on an election night) by lot.
                if prev_place < place && ord == std::cmp::Ordering::Greater {
                    p.add(
                        f,
                        &rec,
                        "mark",
                        at("mark"),
                        format!("place {place} has a better mark than place {prev_place}"),
                    );
                }
            }
        }
        let e = &c.entries[i];
        // Awards are given only when a final is over; heats place without them.
        // (The same rule as `Dataset::awards_in`.)
        // A draw is a result with no award due.
        let expected =
            if c.status == Status::Final && c.phase == "final" && !super::sides::is_draw(c) {
                scenario
                    .awards
                    .get(place as usize - 1)
                    .filter(|_| place >= 1)
            } else {
                None
            };
        if place == 0 {
            p.add(f, &rec, "place", at("place"), "places start at 1");
            continue;
        }
        if e.award.as_ref() != expected {
            let msg = match (expected, &e.award) {
                (Some(x), None) => {
                    format!("place {place} in a final contest should carry the award {x:?}")
                }
                (None, Some(a)) if c.status != Status::Final => {
                    format!("award {a:?} given before the contest is final")
                }
                (None, Some(a)) => format!("award {a:?} contradicts place {place}"),
                (Some(x), Some(a)) => {
                    format!("award {a:?} contradicts place {place} (expected {x:?})")
                }
                (None, None) => unreachable!("equal"),
            };
            p.add(f, &rec, "award", at("award"), msg);
        }
    }
    for (i, e) in c.entries.iter().enumerate() {
        if e.place.is_none() && e.award.is_some() {
            p.add(
                f,
                &format!("{} entry {}", c.id, i + 1),
                "award",
                format!("/{ci}/entries/{i}/award"),
                "an award needs a place",
            );
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The demo's files, with some replaced.
    fn load_with(replaced: &[(&str, &str)]) -> Result<Dataset, LoadError> {
        let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("dataset-demo/games");
        load_files(&|name: &str| {
            let text = match replaced.iter().find(|(n, _)| *n == name) {
                Some((_, t)) => t.to_string(),
                None => std::fs::read_to_string(dir.join(name)).expect("the demo file"),
            };
            Ok((format!("data/{name}"), text))
        })
    }

    fn problems(result: Result<Dataset, LoadError>) -> Vec<DataProblem> {
        match result {
            Err(LoadError::Invalid(p)) => p,
            Err(e) => panic!("{e}"),
            Ok(_) => panic!("the data loads"),
        }
    }

    fn at(p: &DataProblem) -> (usize, usize) {
        (p.line.expect("located"), p.column.expect("located"))
    }

    const GROUPS: &str =
        "[\n  {\"id\": \"x\", \"name\": \"X\"},\n  {\"id\": \"x\", \"name\": \"Y\"}\n]\n";

    #[test]
    fn a_data_rule_problem_is_at_the_value_at_fault() {
        let p = problems(load_with(&[("groups.json", GROUPS)]));
        let dup = p
            .iter()
            .find(|p| p.message == "duplicate id")
            .expect("the duplicate is reported");
        assert_eq!(dup.file, "data/groups.json");
        assert_eq!(dup.pointer, "/1/id");
        assert_eq!(at(dup), (3, 10));
        assert!(
            dup.to_string()
                .starts_with("data/groups.json:3:10: record x: field id: duplicate id"),
            "{dup}"
        );
        // Every competitor's group is now unknown: each at its own line.
        let unknown: Vec<&DataProblem> = p
            .iter()
            .filter(|p| p.file.ends_with("competitors.json") && p.field == "group")
            .collect();
        assert!(unknown.len() > 10);
        let mut lines: Vec<usize> = unknown.iter().map(|p| at(p).0).collect();
        lines.dedup();
        assert_eq!(lines.len(), unknown.len(), "one line each");
        // Sorted as the files are read: scenario, sports, groups, ...
        assert!(p[0].file.ends_with("groups.json"), "{}", p[0]);
    }

    #[test]
    fn a_problem_with_a_field_that_is_absent_is_at_its_record() {
        let contests = r#"[{"id": "c", "sport": "athletics", "discipline": "100m", "phase": "final",
  "start": "2027-08-14T19:40", "status": "final", "measure": "time",
  "entries": [
    {"place": 1, "mark": "9.99"}
  ]}]"#;
        let p = problems(load_with(&[("contests.json", contests)]));
        let needs = p
            .iter()
            .find(|p| p.message.contains("needs a competitor or a group"))
            .unwrap();
        assert_eq!(needs.pointer, "/0/entries/0/competitor");
        assert_eq!(at(needs), (4, 5));
    }

    #[test]
    fn every_file_that_does_not_read_is_reported_and_each_record_on_its_own() {
        let p = problems(load_with(&[
            ("scenario.json", "{\"id\": \"games\",,}"),
            (
                "groups.json",
                "[\n  {\"id\": \"a\", \"name\": \"A\", \"colour\": \"red\"},\n  {\"id\": \"b\"},\n  {\"id\": \"c\", \"name\": \"C\"}\n]",
            ),
        ]));
        let lines: Vec<String> = p.iter().map(|p| p.to_string()).collect();
        assert_eq!(
            lines,
            [
                "data/scenario.json:1:16: key must be a string",
                // Unknown field: at its name.
                "data/groups.json:2:28: record a: unknown field `colour`, expected one of `id`, `name`, `code`, `aliases`, `plural`",
                // Missing field: at its record.
                "data/groups.json:3:3: record b: missing field `name`",
            ],
            "{lines:#?}"
        );
    }

    #[test]
    fn serde_names_for_types_are_said_as_json_names() {
        let p = problems(load_with(&[(
            "groups.json",
            "[{\"id\": \"a\", \"name\": \"A\", \"plural\": \"yes\", \"aliases\": \"A\"}]",
        )]));
        assert_eq!(p.len(), 1, "{p:?}");
        assert_eq!(
            p[0].message,
            "invalid type: string \"yes\", expected true or false"
        );
        assert_eq!(at(&p[0]), (1, 37));
        let p = problems(load_with(&[("groups.json", "[\"harbour\"]")]));
        assert_eq!(
            p[0].to_string(),
            "data/groups.json:1:2: record #1: invalid type: string \"harbour\", expected an object {...}"
        );
        let p = problems(load_with(&[("groups.json", "{}")]));
        assert_eq!(
            p[0].to_string(),
            "data/groups.json:1:1: expected an array of records: [ {...}, {...} ]"
        );
    }
}
