//! Reading a scenario folder and checking it before anything is served.
//!
//! A scenario is a folder of JSON files: `scenario.json` (one object) and
//! `sports.json`, `groups.json`, `competitors.json`, `contests.json` (arrays).
//! Every problem is collected, not just the first, so an editor can fix a file
//! in one pass; each names the file, the record and the field.

use std::collections::{HashMap, HashSet};
use std::fmt;
use std::path::{Path, PathBuf};

use jiff::{civil::DateTime, tz::TimeZone, Timestamp};
use serde::de::DeserializeOwned;

use super::mark;
use super::model::*;
use super::{ContestFacts, Dataset};

/// One thing wrong with the data.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub struct DataProblem {
    /// The file, relative to what the caller gave.
    pub file: String,
    /// The record's id, or its position when it has none.
    pub record: String,
    /// The field at fault.
    pub field: String,
    pub message: String,
}

impl fmt::Display for DataProblem {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        if self.record.is_empty() {
            write!(f, "{}: {}", self.file, self.message)
        } else {
            write!(
                f,
                "{}: record {}: field {}: {}",
                self.file, self.record, self.field, self.message
            )
        }
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
pub fn load_files(read: &FileSource) -> Result<Dataset, LoadError> {
    let scenario: Scenario = parse(read("scenario.json")?)?;
    let sports: Vec<Sport> = parse(read("sports.json")?)?;
    let groups: Vec<Group> = parse(read("groups.json")?)?;
    let competitors: Vec<Competitor> = parse(read("competitors.json")?)?;
    let contests: Vec<Contest> = parse(read("contests.json")?)?;
    build(scenario, sports, groups, competitors, contests, 1)
}

fn parse<T: DeserializeOwned>((name, text): (String, String)) -> Result<T, LoadError> {
    serde_json::from_str(&text)
        .map_err(|e| LoadError::File(format!("{name}:{}:{}: {e}", e.line(), e.column())))
}

struct Problems(Vec<DataProblem>);

impl Problems {
    fn add(&mut self, file: &str, record: &str, field: &str, message: impl Into<String>) {
        self.0.push(DataProblem {
            file: file.to_string(),
            record: record.to_string(),
            field: field.to_string(),
            message: message.into(),
        });
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
            p.add(file, &format!("#{}", i + 1), "id", "id is empty");
        } else if ix.insert(key.to_string(), i).is_some() {
            p.add(file, key, "id", "duplicate id");
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
                "expected an RFC 3339 time with offset",
            );
            None
        }
    };
    let mut seen = HashSet::new();
    for a in &scenario.awards {
        if !seen.insert(a) {
            p.add(
                sf,
                &scenario.id,
                "awards",
                format!("award {a:?} listed twice"),
            );
        }
    }

    for (rec, field, msg) in super::table::check_rules(&scenario, &sports) {
        p.add(sf, &rec, &field, msg);
    }

    let sport_ix = index(&sports, |s| &s.id, "sports.json", &mut p);
    for s in &sports {
        let mut ds = HashSet::new();
        for d in &s.disciplines {
            if !ds.insert(&d.id) {
                p.add(
                    "sports.json",
                    &s.id,
                    "disciplines",
                    format!("duplicate discipline id {:?}", d.id),
                );
            }
        }
    }
    let group_ix = index(&groups, |g| &g.id, "groups.json", &mut p);
    let competitor_ix = index(&competitors, |c| &c.id, "competitors.json", &mut p);
    let contest_ix = index(&contests, |c| &c.id, "contests.json", &mut p);

    for c in &competitors {
        let f = "competitors.json";
        if !group_ix.contains_key(&c.group) {
            p.add(f, &c.id, "group", format!("no group with id {:?}", c.group));
        }
        if !sport_ix.contains_key(&c.sport) {
            p.add(f, &c.id, "sport", format!("no sport with id {:?}", c.sport));
        }
        if c.given.trim().is_empty() && c.family.trim().is_empty() {
            p.add(f, &c.id, "family", "a competitor needs a name");
        }
    }

    check_alias_clashes(&groups, &competitors, &mut p);

    let mut facts = Vec::with_capacity(contests.len());
    for c in &contests {
        facts.push(check_contest(
            c,
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
    for c in competitors {
        people
            .entry(normalize(&format!("{} {}", c.given, c.family)))
            .or_insert(&c.id);
        for a in &c.aliases {
            if let Some(g) = group_names.get(&normalize(a)) {
                p.add(
                    "competitors.json",
                    &c.id,
                    "aliases",
                    format!(
                        "alias {a:?} is also a name of group {g:?}: a name must mean one thing"
                    ),
                );
            }
        }
    }
    for g in groups {
        for a in &g.aliases {
            if let Some(c) = people.get(&normalize(a)) {
                p.add(
                    "groups.json",
                    &g.id,
                    "aliases",
                    format!("alias {a:?} is also the name of competitor {c:?}: a name must mean one thing"),
                );
            }
        }
    }
}

#[allow(clippy::too_many_arguments)]
fn check_contest(
    c: &Contest,
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
    match sport_ix.get(&c.sport) {
        None => p.add(f, &c.id, "sport", format!("no sport with id {:?}", c.sport)),
        Some(&s) => {
            if !sports[s].disciplines.iter().any(|d| d.id == c.discipline) {
                p.add(
                    f,
                    &c.id,
                    "discipline",
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
            p.add(f, &c.id, "updated", "expected an RFC 3339 time with offset");
            None
        }
    };
    if let Some(share) = c.counted {
        if !(0.0..=1.0).contains(&share) {
            p.add(f, &c.id, "counted", "expected a share between 0 and 1");
        }
    }
    let better = c.better.unwrap_or(c.measure.default_better());
    let mut marks = Vec::with_capacity(c.entries.len());
    let mut seen = HashSet::new();
    for (i, e) in c.entries.iter().enumerate() {
        let rec = format!("{} entry {}", c.id, i + 1);
        match (&e.competitor, &e.group) {
            (Some(_), Some(_)) => p.add(
                f,
                &rec,
                "competitor",
                "an entry names a competitor or a group, not both",
            ),
            (None, None) => p.add(
                f,
                &rec,
                "competitor",
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
                    format!("no competitor with id {id:?}"),
                ),
                Some(&ci) => {
                    let who = &competitors[ci];
                    if who.sport != c.sport {
                        p.add(
                            f,
                            &rec,
                            "competitor",
                            format!("{id} competes in {}, not {}", who.sport, c.sport),
                        );
                    }
                    if let (Some(a), Some(b)) = (&who.category, &c.category) {
                        if a != b && b != "mixed" {
                            p.add(
                                f,
                                &rec,
                                "competitor",
                                format!("{id} is in category {a}, the contest is {b}"),
                            );
                        }
                    }
                }
            }
            if !seen.insert(id.clone()) {
                p.add(f, &rec, "competitor", format!("{id} is entered twice"));
            }
        }
        if let Some(id) = &e.group {
            if !group_ix.contains_key(id) {
                p.add(f, &rec, "group", format!("no group with id {id:?}"));
            }
            if !seen.insert(format!("group:{id}")) {
                p.add(f, &rec, "group", format!("{id} is entered twice"));
            }
        }
        for m in &e.members {
            if !competitor_ix.contains_key(m) {
                p.add(f, &rec, "members", format!("no competitor with id {m:?}"));
            }
        }
        let mark = match &e.mark {
            None => None,
            Some(text) => match mark::parse(c.measure, text) {
                Ok(m) => Some(m),
                Err(err) => {
                    p.add(f, &rec, "mark", err.to_string());
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
                format!("an entry with status {:?} has no place", e.status),
            );
        }
        if let Some(a) = &e.award {
            if !scenario.awards.contains(a) {
                p.add(f, &rec, "award", format!("unknown award {a:?}"));
            }
        }
    }
    for (rec, field, msg) in super::sides::check(c) {
        p.add(f, &rec, field, msg);
    }
    check_places(c, &marks, better, scenario, p);
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
        // Standard competition ranking: a place equals one plus the number of
        // entries placed strictly ahead of it.
        let ahead = placed.iter().filter(|(q, _)| *q < place).count() as u32;
        if place != ahead + 1 {
            p.add(
                f,
                &rec,
                "place",
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
            p.add(f, &rec, "place", "places start at 1");
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
            p.add(f, &rec, "award", msg);
        }
    }
    for (i, e) in c.entries.iter().enumerate() {
        if e.place.is_none() && e.award.is_some() {
            p.add(
                f,
                &format!("{} entry {}", c.id, i + 1),
                "award",
                "an award needs a place",
            );
        }
    }
}
