//! Live changes to the results: a batch of changes applied all or nothing.
//!
//! A batch is applied to a copy of the current records and the copy is
//! checked exactly as a scenario's files are at start-up ([`super::load::build`]).
//! Only a copy that passes every check becomes the next version; otherwise
//! every problem is reported and the current version stays as it was.

use serde::{Deserialize, Serialize};

use super::load::{build, record, records, syntax, DataProblem, LoadError, FILES};
use super::locate::Spans;
use super::model::{Competitor, Contest, Entry, Group, Id, Scenario, Sport, Status};
use super::Dataset;

/// A batch of changes, as posted by the newsroom's results feed or an
/// editor.
#[derive(Debug, Clone, Deserialize, Serialize, schemars::JsonSchema)]
#[serde(deny_unknown_fields)]
pub struct Batch {
    /// When the newsroom confirmed these results (RFC 3339); by default the
    /// time the batch is applied.
    #[serde(default)]
    pub as_of: Option<String>,
    pub changes: Vec<Change>,
}

/// One change.
#[derive(Debug, Clone, Deserialize, Serialize, schemars::JsonSchema)]
#[serde(tag = "change", rename_all = "snake_case", deny_unknown_fields)]
pub enum Change {
    /// New or corrected results of a contest, and its status (scheduled →
    /// live → final, or a race called). Entries, when given, replace the
    /// contest's entries whole.
    Results {
        contest: Id,
        #[serde(default)]
        status: Option<Status>,
        #[serde(default)]
        entries: Option<Vec<Entry>>,
        /// When these results were last updated (RFC 3339).
        #[serde(default)]
        updated: Option<String>,
        /// Share of the expected count that is in, from 0 to 1.
        #[serde(default)]
        counted: Option<f64>,
    },
    /// A new start time or venue.
    Schedule {
        contest: Id,
        #[serde(default)]
        start: Option<String>,
        #[serde(default)]
        venue: Option<String>,
    },
    /// A contest added to the programme.
    AddContest { contest: Box<Contest> },
    /// A competitor added to the data.
    AddCompetitor { competitor: Competitor },
    /// Names readers use, added to a record.
    Aliases {
        /// `competitor`, `group`, `contest` or `sport`.
        of: String,
        id: Id,
        add: Vec<String>,
    },
}

/// The records of a whole scenario, as its five files hold them.
#[derive(Debug, Clone, Deserialize, Serialize, schemars::JsonSchema)]
#[serde(deny_unknown_fields)]
pub struct Records {
    pub scenario: Scenario,
    pub sports: Vec<Sport>,
    pub groups: Vec<Group>,
    pub competitors: Vec<Competitor>,
    pub contests: Vec<Contest>,
}

/// Whether replacing `current` by `new` removes more than `share` (0 to 1)
/// of the sports, groups, competitors or contests: a whole-dataset
/// replacement that drops most records is more likely a broken export than
/// a real change. Each kind over the share is one problem, naming its file.
pub fn removes_too_much(current: &Records, new: &Records, share: f64) -> Vec<DataProblem> {
    fn removed<T>(old: &[T], new: &[T], id: impl Fn(&T) -> &str) -> (usize, usize) {
        let kept: std::collections::HashSet<&str> = new.iter().map(&id).collect();
        let gone = old.iter().filter(|r| !kept.contains(id(r))).count();
        (gone, old.len())
    }
    let kinds = [
        (
            "sports.json",
            "sports",
            removed(&current.sports, &new.sports, |r| &r.id),
        ),
        (
            "groups.json",
            "groups",
            removed(&current.groups, &new.groups, |r| &r.id),
        ),
        (
            "competitors.json",
            "competitors",
            removed(&current.competitors, &new.competitors, |r| &r.id),
        ),
        (
            "contests.json",
            "contests",
            removed(&current.contests, &new.contests, |r| &r.id),
        ),
    ];
    kinds
        .into_iter()
        .filter(|(_, _, (gone, of))| *of > 0 && (*gone as f64) > share * (*of as f64))
        .map(|(file, what, (gone, of))| {
            DataProblem::new(
                file,
                "",
                "id",
                String::new(),
                format!(
                    "the replacement removes {gone} of {of} {what}, more than {:.0}%; send it with ?force=true if that is meant",
                    share * 100.0
                ),
            )
        })
        .collect()
}

impl Records {
    /// The records of a loaded dataset.
    pub fn of(data: &Dataset) -> Records {
        Records {
            scenario: data.scenario.clone(),
            sports: data.sports.clone(),
            groups: data.groups.clone(),
            competitors: data.competitors.clone(),
            contests: data.contests.clone(),
        }
    }

    /// Checks the records and builds them as `version`.
    pub fn build(self, version: u64) -> Result<Dataset, LoadError> {
        build(
            self.scenario,
            self.sports,
            self.groups,
            self.competitors,
            self.contests,
            version,
        )
    }
}

/// Name of a batch's body in its problems.
pub const BATCH: &str = "batch";

/// Reads a batch from its JSON text. A syntax error is reported at its line
/// and column; otherwise every change that does not fit the format is
/// reported, each at the place serde stopped in it.
pub fn parse(text: &str) -> Result<Batch, Vec<DataProblem>> {
    if let Ok(batch) = serde_json::from_str(text) {
        return Ok(batch);
    }
    let mut p = Vec::new();
    let Some(spans) = syntax(BATCH, text, &mut p) else {
        return Err(p);
    };
    let whole = record::<Batch>(BATCH, text, &spans, "", &mut p);
    if let Some(batch) = whole {
        return Ok(batch);
    }
    // The first problem serde met may hide others: each change is read on
    // its own, and the whole batch's problem stays only when no change has
    // one (a misspelt top-level field, say).
    let mut each = Vec::new();
    if let Some(items) = spans.member("changes").and_then(Spans::items) {
        for (i, item) in items.iter().enumerate() {
            record::<Change>(BATCH, text, item, &format!("change {}", i + 1), &mut each);
        }
    }
    Err(if each.is_empty() { p } else { each })
}

/// Name of a whole dataset's body (`PUT /v1/admin/dataset`) in its problems.
pub const DATASET: &str = "dataset";

/// Reads a whole dataset from its JSON text, as [`parse`] reads a batch:
/// a syntax error at its line and column, else every record that does not
/// fit the format, each read on its own.
pub fn parse_records(text: &str) -> Result<Records, Vec<DataProblem>> {
    if let Ok(records) = serde_json::from_str(text) {
        return Ok(records);
    }
    let mut p = Vec::new();
    let Some(spans) = syntax(DATASET, text, &mut p) else {
        return Err(p);
    };
    if let Some(r) = record::<Records>(DATASET, text, &spans, "", &mut p) {
        return Ok(r);
    }
    let mut each = Vec::new();
    if let Some(s) = spans.member("scenario") {
        record::<Scenario>(DATASET, text, s, "scenario", &mut each);
    }
    records::<Sport>(DATASET, text, spans.member("sports"), &mut each);
    records::<Group>(DATASET, text, spans.member("groups"), &mut each);
    records::<Competitor>(DATASET, text, spans.member("competitors"), &mut each);
    records::<Contest>(DATASET, text, spans.member("contests"), &mut each);
    Err(if each.is_empty() { p } else { each })
}

/// Places the problems of a whole dataset at their line and column in its
/// text: a problem in `contests.json` at `/3/mark` is at
/// `/contests/3/mark` of the body, its record named with its file.
pub fn locate_records(problems: &mut [DataProblem], text: &str) {
    let Some(spans) = Spans::scan(text) else {
        return;
    };
    for p in problems.iter_mut().filter(|p| p.line.is_none()) {
        let Some(file) = FILES.iter().find(|f| **f == p.file) else {
            continue;
        };
        let member = file.trim_end_matches(".json");
        p.pointer = format!("/{member}{}", p.pointer);
        p.record = if p.record.is_empty() {
            file.to_string()
        } else {
            format!("{file} {}", p.record)
        };
        p.locate(DATASET, text, &spans);
    }
}

/// Places the batch's problems at their line and column in the batch's
/// text, reported under `name`; problems about records the batch did not
/// touch stay as they are.
pub fn locate(problems: &mut [DataProblem], name: &str, text: &str) {
    let spans = Spans::scan(text);
    for problem in problems.iter_mut().filter(|p| p.file == BATCH) {
        match &spans {
            Some(s) if problem.line.is_none() => problem.locate(name, text, s),
            _ => problem.file = name.to_string(),
        }
    }
}

/// How far past the real time a batch's `as_of` may be: a day, for clocks
/// that disagree, never a mistyped date.
const MAX_AHEAD_SECONDS: i64 = 24 * 3600;

/// For a service on the real clock: a batch dated more than a day after
/// `now` is a mistyped date, refused before it moves the data's time. (A
/// replayed night on a demo clock is dated as it likes.)
pub fn check_not_ahead(batch: &Batch, now: jiff::Timestamp) -> Result<(), Vec<DataProblem>> {
    let Some(t) = &batch.as_of else {
        return Ok(());
    };
    match t.parse::<jiff::Timestamp>() {
        Ok(at) if at.as_second() - now.as_second() > MAX_AHEAD_SECONDS => Err(vec![problem(
            0,
            "as_of",
            &format!("{t} is more than a day after now"),
        )]),
        _ => Ok(()),
    }
}

/// Applies a batch to `data`: the next version, or every problem found.
/// `now` (RFC 3339) is the `as_of` when the batch gives none. A batch's
/// `as_of` may not go back before the data's.
pub fn apply(data: &Dataset, batch: &Batch, now: &str) -> Result<Dataset, Vec<DataProblem>> {
    let mut r = Records::of(data);
    let mut problems = Vec::new();
    if batch.changes.is_empty() {
        problems.push(problem(0, "changes", "a batch needs at least one change"));
    }
    // A change that cannot be made is left out and the others are made,
    // so the records' check below still finds the problems they have.
    for (i, change) in batch.changes.iter().enumerate() {
        let n = i + 1;
        if let Err(p) = apply_one(&mut r, change, n) {
            problems.push(p);
        }
    }
    if let Some(t) = &batch.as_of {
        // The data's time only moves forward.
        match t.parse::<jiff::Timestamp>() {
            Err(_) => problems.push(problem(0, "as_of", "expected an RFC 3339 time with offset")),
            Ok(at) if at < data.as_of => problems.push(problem(
                0,
                "as_of",
                &format!(
                    "{t} is earlier than the data's as_of; the data's time only moves forward"
                ),
            )),
            Ok(_) => {}
        }
    }
    // Without a time of its own the batch is as of now, unless the data are
    // already later (a fixed clock behind the feed): never backwards. A
    // time that does not read leaves the data's as it was for the check.
    r.scenario.as_of = match &batch.as_of {
        Some(t) if problems.iter().all(|p| p.field != "as_of") => t.clone(),
        Some(_) => r.scenario.as_of.clone(),
        None => match now.parse::<jiff::Timestamp>() {
            Ok(n) if n < data.as_of => r.scenario.as_of.clone(),
            _ => now.to_string(),
        },
    };
    let touched = touched(&r, batch);
    match r.build(data.version + 1) {
        Ok(next) if problems.is_empty() => Ok(next),
        Ok(_) => Err(problems),
        Err(LoadError::Invalid(p)) => {
            problems.extend(p.into_iter().map(|p| in_batch(p, &touched)));
            Err(problems)
        }
        Err(LoadError::File(m)) => {
            problems.push(problem(0, "batch", &m));
            Err(problems)
        }
    }
}

/// A problem with `field` of change `n` (1-based; 0 for the batch itself),
/// placed at that field in the batch; `field` may go on into the value
/// (`add/2`, the third alias).
fn problem(n: usize, field: &str, message: &str) -> DataProblem {
    let (record, pointer) = if n == 0 {
        (String::new(), format!("/{field}"))
    } else {
        (format!("change {n}"), format!("/changes/{}/{field}", n - 1))
    };
    let name = field.split('/').next().unwrap_or(field);
    DataProblem::new(BATCH, &record, name, pointer, message.into())
}

/// For each record the batch changed, by file and index in the records
/// after the batch: the last change that touched it, and the pointer in
/// the batch under which that change holds the record's fields.
type Touched = std::collections::HashMap<(&'static str, usize), (usize, String)>;

fn touched(r: &Records, batch: &Batch) -> Touched {
    let mut out = Touched::new();
    let contest = |id: &str| r.contests.iter().position(|c| c.id == id);
    for (i, change) in batch.changes.iter().enumerate() {
        let here = format!("/changes/{i}");
        let (key, under) = match change {
            Change::Results { contest: id, .. } | Change::Schedule { contest: id, .. } => {
                (contest(id).map(|x| ("contests.json", x)), here)
            }
            Change::AddContest { contest: c } => (
                contest(&c.id).map(|x| ("contests.json", x)),
                format!("{here}/contest"),
            ),
            Change::AddCompetitor { competitor } => (
                r.competitors
                    .iter()
                    .position(|c| c.id == competitor.id)
                    .map(|x| ("competitors.json", x)),
                format!("{here}/competitor"),
            ),
            Change::Aliases { of, id, .. } => {
                let key = match of.as_str() {
                    "competitor" => r
                        .competitors
                        .iter()
                        .position(|c| c.id == *id)
                        .map(|x| ("competitors.json", x)),
                    "group" => r
                        .groups
                        .iter()
                        .position(|g| g.id == *id)
                        .map(|x| ("groups.json", x)),
                    "contest" => contest(id).map(|x| ("contests.json", x)),
                    "sport" => r
                        .sports
                        .iter()
                        .position(|s| s.id == *id)
                        .map(|x| ("sports.json", x)),
                    _ => None,
                };
                // The aliases a change adds stand in its `add` list.
                (key, format!("{here}/add"))
            }
        };
        if let Some(key) = key {
            out.insert(key, (i + 1, under));
        }
    }
    out
}

/// A problem the records' check found, moved into the batch: to the change
/// that made the record it is about, with its record naming both the change
/// and the record. A problem with a record the batch did not touch (an
/// existing group whose alias a new competitor's name now clashes with) is
/// placed at the batch as a whole.
fn in_batch(p: DataProblem, touched: &Touched) -> DataProblem {
    let mut steps = p.pointer.splitn(3, '/').skip(1);
    let index = steps.next().and_then(|s| s.parse::<usize>().ok());
    let rest = steps.next().unwrap_or_default();
    let file = super::load::FILES.iter().find(|f| **f == p.file);
    let found = match (file, index) {
        (Some(file), Some(index)) => touched.get(&(*file, index)),
        _ => None,
    };
    let Some((n, under)) = found else {
        let record = if p.record.is_empty() {
            p.file.clone()
        } else {
            format!("{} {}", p.file, p.record)
        };
        return DataProblem::new(BATCH, &record, &p.field, String::new(), p.message);
    };
    let pointer = if under.ends_with("/add") || rest.is_empty() {
        under.clone()
    } else {
        format!("{under}/{rest}")
    };
    DataProblem::new(
        BATCH,
        &format!("change {n} ({} {})", p.file, p.record),
        &p.field,
        pointer,
        p.message,
    )
}

// A problem is large for an error, but these run once per change of a
// batch, never in a loop that a large error would slow.
#[allow(clippy::result_large_err)]
fn contest_mut<'a>(r: &'a mut Records, id: &str, n: usize) -> Result<&'a mut Contest, DataProblem> {
    r.contests
        .iter_mut()
        .find(|c| c.id == id)
        .ok_or_else(|| problem(n, "contest", &format!("no contest {id:?}")))
}

#[allow(clippy::result_large_err)]
fn apply_one(r: &mut Records, change: &Change, n: usize) -> Result<(), DataProblem> {
    match change {
        Change::Results {
            contest,
            status,
            entries,
            updated,
            counted,
        } => {
            // Checked before anything changes: a change is made whole or
            // not at all.
            if counted.is_some_and(|share| !(0.0..=1.0).contains(&share)) {
                return Err(problem(n, "counted", "counted is a share from 0 to 1"));
            }
            let c = contest_mut(r, contest, n)?;
            if let Some(s) = status {
                c.status = *s;
            }
            if let Some(e) = entries {
                c.entries = e.clone();
            }
            if updated.is_some() {
                c.updated = updated.clone();
            }
            if counted.is_some() {
                c.counted = *counted;
            }
        }
        Change::Schedule {
            contest,
            start,
            venue,
        } => {
            let c = contest_mut(r, contest, n)?;
            if let Some(s) = start {
                c.start = s.clone();
            }
            if venue.is_some() {
                c.venue = venue.clone();
            }
        }
        Change::AddContest { contest } => {
            if r.contests.iter().any(|c| c.id == contest.id) {
                return Err(problem(
                    n,
                    "contest",
                    &format!(
                        "contest {:?} exists already; change it with results or schedule",
                        contest.id
                    ),
                ));
            }
            r.contests.push((**contest).clone());
        }
        Change::AddCompetitor { competitor } => {
            if r.competitors.iter().any(|c| c.id == competitor.id) {
                return Err(problem(
                    n,
                    "competitor",
                    &format!("competitor {:?} exists already", competitor.id),
                ));
            }
            r.competitors.push(competitor.clone());
        }
        Change::Aliases { of, id, add } => {
            let list = match of.as_str() {
                "competitor" => r
                    .competitors
                    .iter_mut()
                    .find(|c| c.id == *id)
                    .map(|c| &mut c.aliases),
                "group" => r
                    .groups
                    .iter_mut()
                    .find(|g| g.id == *id)
                    .map(|g| &mut g.aliases),
                "contest" => r
                    .contests
                    .iter_mut()
                    .find(|c| c.id == *id)
                    .map(|c| &mut c.aliases),
                "sport" => r
                    .sports
                    .iter_mut()
                    .find(|s| s.id == *id)
                    .map(|s| &mut s.aliases),
                other => {
                    return Err(problem(
                        n,
                        "of",
                        &format!("aliases of {other:?}: use competitor, group, contest or sport"),
                    ))
                }
            };
            let Some(list) = list else {
                return Err(problem(n, "id", &format!("no {of} {id:?}")));
            };
            if let Some(k) = add.iter().position(|a| a.trim().is_empty()) {
                return Err(problem(
                    n,
                    &format!("add/{k}"),
                    "an alias must not be empty",
                ));
            }
            for a in add {
                if !list.contains(a) {
                    list.push(a.clone());
                }
            }
        }
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::dataset::demo;

    fn batch(json: &str) -> Batch {
        serde_json::from_str(json).expect("the batch parses")
    }

    #[test]
    fn the_datas_time_only_moves_forward() {
        let d = demo();
        // Dated before the data: refused.
        let early = batch(
            r#"{"as_of": "2027-08-14T20:00:00+01:00", "changes": [
                {"change": "schedule", "contest": "ath-m-marathon-final", "venue": "Harbour Road"}]}"#,
        );
        let err = apply(&d, &early, "2027-08-14T21:10:00+01:00").unwrap_err();
        assert!(err[0].message.contains("only moves forward"), "{err:?}");
        // Undated, with "now" behind the data (a fixed clock behind the
        // feed): the data keep their time.
        let undated = batch(
            r#"{"changes": [{"change": "schedule", "contest": "ath-m-marathon-final", "venue": "Harbour Road"}]}"#,
        );
        let next = apply(&d, &undated, "2027-08-14T20:00:00+01:00").unwrap();
        assert_eq!(next.as_of, d.as_of);
        // Undated with "now" later: as of now.
        let next = apply(&d, &undated, "2027-08-14T21:10:00+01:00").unwrap();
        assert_eq!(next.as_of, "2027-08-14T21:10:00+01:00".parse().unwrap());
    }

    #[test]
    fn a_date_far_ahead_of_the_real_clock_is_a_typo() {
        let now: jiff::Timestamp = "2027-08-14T20:10:00Z".parse().unwrap();
        let typo = batch(
            r#"{"as_of": "2072-08-14T21:30:00+01:00", "changes": [
                {"change": "schedule", "contest": "ath-m-marathon-final", "venue": "Harbour Road"}]}"#,
        );
        assert!(check_not_ahead(&typo, now).is_err());
        let soon = batch(
            r#"{"as_of": "2027-08-15T09:00:00+01:00", "changes": [
                {"change": "schedule", "contest": "ath-m-marathon-final", "venue": "Harbour Road"}]}"#,
        );
        assert!(check_not_ahead(&soon, now).is_ok());
    }

    #[test]
    fn a_valid_batch_makes_the_next_version() {
        let d = demo();
        let b = batch(
            r#"{"as_of": "2027-08-14T21:30:00+01:00", "changes": [
                {"change": "results", "contest": "ath-m-marathon-final", "status": "final", "entries": [
                    {"competitor": "p036", "place": 1, "mark": "2:05:31", "award": "gold"}
                ]},
                {"change": "aliases", "of": "competitor", "id": "p036", "add": ["the Harbour Hare"]}
            ]}"#,
        );
        let next = apply(&d, &b, "2027-08-14T21:31:00+01:00").unwrap();
        assert_eq!(next.version, d.version + 1);
        assert_eq!(next.scenario.as_of, "2027-08-14T21:30:00+01:00");
        let ci = next.contest("ath-m-marathon-final").unwrap();
        assert_eq!(next.contests[ci].status, Status::Final);
        let pi = next.competitor("p036").unwrap();
        assert!(next.competitors[pi]
            .aliases
            .contains(&"the Harbour Hare".to_string()));
    }

    #[test]
    fn an_invalid_batch_lists_every_problem_and_changes_nothing() {
        let d = demo();
        let b = batch(
            r#"{"changes": [
                {"change": "results", "contest": "no-such-race", "status": "final"},
                {"change": "aliases", "of": "venue", "id": "x", "add": ["y"]}
            ]}"#,
        );
        let problems = apply(&d, &b, "2027-08-14T21:31:00+01:00").unwrap_err();
        assert_eq!(problems.len(), 2, "{problems:?}");
        assert!(
            problems[0].to_string().contains("change 1"),
            "{}",
            problems[0]
        );
        assert!(
            problems[1].to_string().contains("change 2"),
            "{}",
            problems[1]
        );
        // Checked as the files are: a final with an award on the wrong place.
        let b = batch(
            r#"{"changes": [{"change": "results", "contest": "ath-m-marathon-final", "status": "final",
                "entries": [{"competitor": "p036", "place": 1, "mark": "2:05:31", "award": "silver"}]}]}"#,
        );
        let problems = apply(&d, &b, "2027-08-14T21:31:00+01:00").unwrap_err();
        assert!(problems.iter().any(|p| p.field == "award"), "{problems:?}");
    }

    /// A batch's problems as `tidings check` and the admin API give them.
    fn refused(text: &str) -> Vec<String> {
        let mut problems = match parse(text) {
            Ok(b) => apply(&demo(), &b, "2027-08-14T21:31:00+01:00").unwrap_err(),
            Err(p) => p,
        };
        locate(&mut problems, BATCH, text);
        problems.iter().map(|p| p.to_string()).collect()
    }

    #[test]
    fn every_problem_of_a_batch_is_at_its_place_in_the_batch() {
        let text = r#"{"as_of": "yesterday", "changes": [
  {"change": "aliases", "of": "group", "id": "quessary", "add": ["Q", " "]},
  {"change": "results", "contest": "ath-m-marathon-final", "status": "final", "counted": 2},
  {"change": "add_competitor", "competitor":
    {"id": "p900", "given": "Ada", "family": "Ness", "group": "atlantis", "sport": "athletics"}},
  {"change": "results", "contest": "ath-m-marathon-final",
   "entries": [{"competitor": "p036", "place": 2, "mark": "2:05:31"}]}
]}"#;
        assert_eq!(
            refused(text),
            [
                "batch:2:71: record change 1: field add: an alias must not be empty",
                "batch:3:90: record change 2: field counted: counted is a share from 0 to 1",
                "batch:1:11: field as_of: expected an RFC 3339 time with offset",
                "batch:5:63: record change 3 (competitors.json p900): field group: no group with id \"atlantis\"",
                "batch:7:48: record change 4 (contests.json ath-m-marathon-final entry 1): field place: place 2 does not follow the places before it (expected 1)",
            ]
        );
    }

    #[test]
    fn a_problem_with_a_record_the_batch_did_not_touch_is_at_the_batch() {
        // A new competitor named as an existing delegation's alias: the
        // clash is found on the delegation, which the batch did not touch.
        let d = demo();
        let g = &d.groups[0];
        let alias = g.aliases.first().expect("the demo's groups have aliases");
        let text = format!(
            r#"{{"changes": [{{"change": "add_competitor", "competitor":
  {{"id": "p900", "given": "{alias}", "family": "", "group": "{}", "sport": "athletics"}}}}]}}"#,
            g.id
        );
        let lines = refused(&text);
        assert!(
            lines.iter().any(|l| l.starts_with(&format!(
                "batch:1:1: record groups.json {}: field aliases:",
                g.id
            ))),
            "{lines:?}"
        );
    }

    #[test]
    fn every_change_that_does_not_fit_the_format_is_reported() {
        let text = "{\"changes\": [\n  {\"change\": \"results\"},\n  {\"change\": \"schedule\", \"contest\": \"x\", \"when\": \"soon\"}\n]}";
        assert_eq!(
            refused(text),
            [
                "batch:2:3: record change 1: missing field `contest`",
                "batch:3:42: record change 2: unknown field `when`, expected one of `contest`, `start`, `venue`",
            ]
        );
        // A misspelt top-level field, with every change fine.
        assert_eq!(
            refused("{\"chnages\": []}"),
            ["batch:1:2: unknown field `chnages`, expected `as_of` or `changes`"]
        );
    }
}
