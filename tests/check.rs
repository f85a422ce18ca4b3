//! Editors' mistakes stop start-up and `tidings check` with the place and a
//! plain sentence; data mistakes name file, record and field.

use std::path::{Path, PathBuf};
use std::process::Command;

fn demo_intents() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("intents/games")
}

fn demo_data() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("dataset-demo/games")
}

/// A copy of the demo intents with one file replaced.
fn intents_with(name: &str, text: &str) -> tempdir::Dir {
    let dir = tempdir::Dir::new();
    for e in std::fs::read_dir(demo_intents()).unwrap().flatten() {
        std::fs::copy(e.path(), dir.path().join(e.file_name())).unwrap();
    }
    std::fs::write(dir.path().join(name), text).unwrap();
    dir
}

/// A copy of the demo data with one file edited.
fn data_with(name: &str, edit: impl Fn(serde_json::Value) -> serde_json::Value) -> tempdir::Dir {
    let dir = tempdir::Dir::new();
    for e in std::fs::read_dir(demo_data()).unwrap().flatten() {
        std::fs::copy(e.path(), dir.path().join(e.file_name())).unwrap();
    }
    let p = dir.path().join(name);
    let v: serde_json::Value = serde_json::from_str(&std::fs::read_to_string(&p).unwrap()).unwrap();
    std::fs::write(&p, serde_json::to_string_pretty(&edit(v)).unwrap()).unwrap();
    dir
}

mod tempdir {
    use std::path::{Path, PathBuf};
    use std::sync::atomic::{AtomicU32, Ordering};

    static N: AtomicU32 = AtomicU32::new(0);

    /// A folder removed when dropped.
    pub struct Dir(PathBuf);
    impl Dir {
        pub fn new() -> Dir {
            let p = std::env::temp_dir().join(format!(
                "tidings-check-{}-{}",
                std::process::id(),
                N.fetch_add(1, Ordering::SeqCst)
            ));
            std::fs::create_dir_all(&p).unwrap();
            Dir(p)
        }
        pub fn path(&self) -> &Path {
            &self.0
        }
    }
    impl Drop for Dir {
        fn drop(&mut self) {
            let _ = std::fs::remove_dir_all(&self.0);
        }
    }
}

fn check(args: &[&str]) -> (i32, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_tidings"))
        .arg("check")
        .args(args)
        .output()
        .unwrap();
    let text =
        String::from_utf8_lossy(&out.stdout).to_string() + &String::from_utf8_lossy(&out.stderr);
    (out.status.code().unwrap_or(-1), text)
}

#[test]
fn the_demo_checks_clean() {
    let (code, out) = check(&[]);
    assert_eq!(code, 0, "{out}");
    assert!(out.contains("ok:"), "{out}");
}

const GOOD: &str = r#"intent: extra
operation: podium
phrasings:
  - who won the {contest}
slots:
  contest:
    entity: contest
    required: true
    ask: Which event?
replies:
  answered: "{winner|and} won."
  award: "{holders|and} won {award}."
  not_awarded: "No {award}."
  live: "Under way."
  scheduled: "Due {start}."
  no_result: "Nothing yet."
  placings: "{first|and} first."
  no_awards: "No medals in this round."
answers: [who, results]
"#;

fn expect_error(file_text: &str, needle: &str, line: u32) {
    let dir = intents_with("extra.yaml", file_text);
    let (code, out) = check(&["--intents", dir.path().to_str().unwrap()]);
    assert_eq!(code, 1, "{out}");
    let want = format!("extra.yaml:{line}:");
    let hit = out
        .lines()
        .find(|l| l.contains(&want) && l.contains(needle));
    assert!(hit.is_some(), "expected {want}…{needle} in:\n{out}");
}

#[test]
fn a_valid_new_intent_is_accepted() {
    let dir = intents_with(
        "extra.yaml",
        &GOOD
            .replace(
                "award: \"{holders|and} won {award}.\"",
                "award: \"{holders|and} won.\"",
            )
            .replace("No {award}.", "None."),
    );
    // {award} is not a slot of this intent: that is an error, so declare it.
    let (code, out) = check(&["--intents", dir.path().to_str().unwrap()]);
    assert_eq!(code, 0, "{out}");
}

#[test]
fn an_unknown_operation_is_named_with_its_place() {
    expect_error(
        &GOOD.replace("operation: podium", "operation: podiumm"),
        "unknown operation \"podiumm\"",
        2,
    );
}

#[test]
fn a_placeholder_with_no_slot_is_an_error() {
    expect_error(
        &GOOD.replace("who won the {contest}", "who won the {race}"),
        "placeholder {race} has no slot",
        4,
    );
}

#[test]
fn a_slot_the_operation_does_not_take_is_an_error() {
    let text = GOOD.replace("replies:", "  venue:\n    entity: sport\nreplies:");
    expect_error(&text, "slot \"venue\" is not used by operation podium", 11);
}

#[test]
fn a_slot_of_the_wrong_kind_is_an_error() {
    expect_error(
        &GOOD.replace("entity: contest", "entity: competitor"),
        "must hold a contest",
        7,
    );
}

#[test]
fn a_reply_placeholder_unknown_to_the_outcome_is_an_error() {
    expect_error(
        &GOOD.replace("\"{winner|and} won.\"", "\"{champion} won.\""),
        "placeholder {champion}",
        11,
    );
}

#[test]
fn missing_wording_for_an_outcome_is_an_error() {
    expect_error(
        &GOOD.replace("  live: \"Under way.\"\n", ""),
        "outcome \"live\"",
        11,
    );
}

#[test]
fn broken_yaml_reports_line_and_column() {
    let dir = intents_with("extra.yaml", "intent: x\nphrasings: [unclosed\n");
    let (code, out) = check(&["--intents", dir.path().to_str().unwrap()]);
    assert_eq!(code, 1, "{out}");
    assert!(
        out.lines().any(|l| l.contains("extra.yaml:")
            && l.split(':')
                .nth(1)
                .is_some_and(|n| n.trim().parse::<u32>().is_ok())),
        "{out}"
    );
}

#[test]
fn an_unknown_filter_points_into_the_wording() {
    expect_error(
        &GOOD.replace("{winner|and}", "{winner|shout}"),
        "unknown filter",
        11,
    );
}

/// The output line of `tidings check` that names `file` and holds
/// `needle`, and the text of that file from the line and column it gives.
fn located<'a>(out: &'a str, dir: &Path, file: &str, needle: &str) -> (&'a str, String) {
    let (line, _, from) = located_at(out, dir, file, needle);
    (line, from)
}

/// [`located`], with the line number given.
fn located_at<'a>(out: &'a str, dir: &Path, file: &str, needle: &str) -> (&'a str, usize, String) {
    let line = out
        .lines()
        .find(|l| l.contains(&format!("{file}:")) && l.contains(needle))
        .unwrap_or_else(|| panic!("no line for {file} with {needle:?} in:\n{out}"));
    let after = line.split(&format!("{file}:")).nth(1).unwrap();
    let mut parts = after.splitn(3, ':');
    let l: usize = parts
        .next()
        .unwrap()
        .parse()
        .unwrap_or_else(|_| panic!("{line}"));
    let c: usize = parts
        .next()
        .unwrap()
        .parse()
        .unwrap_or_else(|_| panic!("{line}"));
    let text = std::fs::read_to_string(dir.join(file)).unwrap();
    let from: String = text
        .lines()
        .nth(l - 1)
        .unwrap_or_else(|| panic!("{line}: no line {l}"))
        .chars()
        .skip(c - 1)
        .collect();
    (line, l, from)
}

#[test]
fn data_problems_name_file_record_and_field_at_their_place() {
    // A dangling reference: at the value that dangles.
    let dir = data_with("competitors.json", |mut v| {
        v[0]["group"] = "nowhere".into();
        v
    });
    let (code, out) = check(&["--data", dir.path().to_str().unwrap()]);
    assert_eq!(code, 1);
    let (line, there) = located(&out, dir.path(), "competitors.json", "nowhere");
    assert!(
        line.contains(": record p001: field group: no group with id \"nowhere\""),
        "{line}"
    );
    assert!(
        there.starts_with("\"nowhere\""),
        "{line} points at {there:?}"
    );

    // A duplicate id and a mark that does not parse for its measure.
    let dir = data_with("contests.json", |mut v| {
        let mut first = v[0].clone();
        first["entries"][0]["mark"] = "fast".into();
        v.as_array_mut().unwrap().push(first);
        v
    });
    let (code, out) = check(&["--data", dir.path().to_str().unwrap()]);
    assert_eq!(code, 1);
    // The second of the two records with one id is at fault.
    let (line, at, there) = located_at(&out, dir.path(), "contests.json", "field id: duplicate id");
    let text = std::fs::read_to_string(dir.path().join("contests.json")).unwrap();
    let v: serde_json::Value = serde_json::from_str(&text).unwrap();
    let id = format!("\"{}\"", v[0]["id"].as_str().unwrap());
    let last = text
        .lines()
        .enumerate()
        .filter(|(_, l)| l.contains(&format!("\"id\": {id}")))
        .map(|(i, _)| i + 1)
        .last()
        .unwrap();
    assert_eq!(at, last, "{line}");
    assert!(there.starts_with(&id), "{line} points at {there:?}");
    let (line, there) = located(&out, dir.path(), "contests.json", "field mark:");
    assert!(there.starts_with("\"fast\""), "{line} points at {there:?}");
}

#[test]
fn a_missing_field_is_reported_at_its_record() {
    // An entry with neither a competitor nor a group: at the entry.
    let dir = data_with("contests.json", |mut v| {
        v[2]["entries"][0] = serde_json::json!({"place": 1, "mark": "1.00"});
        v
    });
    let (code, out) = check(&["--data", dir.path().to_str().unwrap()]);
    assert_eq!(code, 1);
    let (line, there) = located(
        &out,
        dir.path(),
        "contests.json",
        "needs a competitor or a group",
    );
    assert!(line.contains("field competitor"), "{line}");
    assert_eq!(there, "{", "{line} points at {there:?}");
}

#[test]
fn an_alias_that_is_also_a_delegations_name_is_reported() {
    let dir = data_with("competitors.json", |mut v| {
        v[0]["aliases"] = serde_json::json!(["quessary"]);
        v
    });
    let (code, out) = check(&["--data", dir.path().to_str().unwrap()]);
    assert_eq!(code, 1);
    let (line, there) = located(
        &out,
        dir.path(),
        "competitors.json",
        "is also a name of group",
    );
    assert!(
        line.contains(": record p001: field aliases: alias \"quessary\" is also a name of group"),
        "{line}"
    );
    assert!(
        there.starts_with("\"quessary\""),
        "{line} points at {there:?}"
    );
}

#[test]
fn an_award_that_contradicts_the_places_is_reported() {
    let dir = data_with("contests.json", |mut v| {
        let ix = v
            .as_array()
            .unwrap()
            .iter()
            .position(|c| c["id"] == "ath-m-100m-final")
            .unwrap();
        v[ix]["entries"][1]["award"] = "gold".into();
        v
    });
    let (code, out) = check(&["--data", dir.path().to_str().unwrap()]);
    assert_eq!(code, 1);
    assert!(
        out.contains("ath-m-100m-final entry 2: field award: award \"gold\" contradicts place 2"),
        "{out}"
    );
}

#[test]
fn json_syntax_errors_have_line_and_column() {
    let dir = tempdir::Dir::new();
    for e in std::fs::read_dir(demo_data()).unwrap().flatten() {
        std::fs::copy(e.path(), dir.path().join(e.file_name())).unwrap();
    }
    std::fs::write(dir.path().join("groups.json"), "[\n  {\"id\": \"x\",\n}\n]").unwrap();
    let (code, out) = check(&["--data", dir.path().to_str().unwrap()]);
    assert_eq!(code, 1);
    assert!(out.contains("groups.json:3:1:"), "{out}");
}

#[test]
fn paths_are_checked_with_every_problem_located() {
    // The shipped files, given as paths, check clean.
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let (code, out) = check(&[
        demo_intents().to_str().unwrap(),
        demo_data().to_str().unwrap(),
        root.join("src/answers/channels.yaml").to_str().unwrap(),
    ]);
    assert_eq!(code, 0, "{out}");

    // A broken intent, a broken channel profile and inconsistent data at
    // once: every problem, each with file:line:column.
    let intents = intents_with("extra.yaml", "intent: broken\noperation: podium\nphrasings: [who won]\nreplies: {answered: \"{nobody}\"}\n");
    let channels = intents.path().join("channels.yaml");
    std::fs::write(&channels, "kiosk:\n  words: shouted\n").unwrap();
    let data = data_with("competitors.json", |mut v| {
        v[3]["group"] = serde_json::json!("atlantis");
        v
    });
    let (code, out) = check(&[
        intents.path().to_str().unwrap(),
        channels.to_str().unwrap(),
        data.path().to_str().unwrap(),
    ]);
    assert_eq!(code, 1, "{out}");
    assert!(
        out.contains("channels.yaml:2:10: channel kiosk: words must be written or spoken"),
        "{out}"
    );
    // The intent's problem at its line and column: "extra.yaml:<l>:<c>:".
    assert!(
        out.lines().any(|l| {
            let after = l.split("extra.yaml:").nth(1).unwrap_or_default();
            let mut parts = after.splitn(3, ':');
            parts
                .next()
                .is_some_and(|n| n.parse::<u32>().is_ok_and(|n| n >= 1))
                && parts
                    .next()
                    .is_some_and(|n| n.parse::<u32>().is_ok_and(|n| n >= 1))
        }),
        "{out}"
    );
    let data_line = out
        .lines()
        .find(|l| l.contains("competitors.json:") && l.contains("atlantis"))
        .unwrap_or_else(|| panic!("{out}"));
    // The line is where the record's id stands, not the top of the file.
    let loc: Vec<&str> = data_line.splitn(4, ':').collect();
    assert!(loc[1].parse::<u32>().unwrap() > 1, "{data_line}");
    let (code, out) = check(&["no/such/place"]);
    assert_eq!(code, 1);
    assert!(out.contains("no such file or folder"), "{out}");
}

#[test]
fn wording_for_a_channel_that_does_not_exist_is_located() {
    let text = format!("{GOOD}channel_replies:\n  pigeon:\n    answered: \"Coo.\"\n");
    expect_error(&text, "no channel \"pigeon\"", 22);
}

/// A copy of the demo data with some files replaced by texts as given.
fn data_with_texts(files: &[(&str, &str)]) -> tempdir::Dir {
    let dir = tempdir::Dir::new();
    for e in std::fs::read_dir(demo_data()).unwrap().flatten() {
        std::fs::copy(e.path(), dir.path().join(e.file_name())).unwrap();
    }
    for (name, text) in files {
        if let Some(parent) = Path::new(name).parent() {
            std::fs::create_dir_all(dir.path().join(parent)).unwrap();
        }
        std::fs::write(dir.path().join(name), text).unwrap();
    }
    dir
}

#[test]
fn every_broken_file_and_every_broken_record_is_reported_at_once() {
    let dir = data_with_texts(&[
        // A syntax error: serde's line and column.
        ("groups.json", "[\n  {\"id\": \"x\", \"name\": \"X\"}\n  {\"id\": \"y\"}\n]\n"),
        // Two records that do not fit the format, and one that does.
        (
            "competitors.json",
            concat!(
                "[\n",
                "  {\"id\": \"a\", \"given\": \"A\", \"family\": \"B\", \"group\": \"x\", \"sport\": \"athletics\", \"nickname\": \"Ace\"},\n",
                "  {\"id\": \"b\", \"given\": \"C\", \"family\": \"D\", \"group\": \"x\", \"sport\": \"athletics\"},\n",
                "  {\"id\": \"c\", \"given\": \"E\", \"family\": 7, \"group\": \"x\", \"sport\": \"athletics\"}\n",
                "]\n"
            ),
        ),
        // Not an array at all.
        ("sports.json", "{\"id\": \"athletics\"}\n"),
    ]);
    let (code, out) = check(&[dir.path().to_str().unwrap()]);
    assert_eq!(code, 1, "{out}");
    // One line per problem, and no rule between records is checked while
    // records do not read (every reference would look broken).
    assert_eq!(out.lines().count(), 5, "{out}");
    assert!(out.contains("4 problem(s)"), "{out}");
    let (line, there) = located(&out, dir.path(), "groups.json", "expected");
    assert!(line.contains("groups.json:3:3:"), "{line}");
    assert!(there.starts_with("{\"id\": \"y\"}"), "{there:?}");
    let (line, there) = located(&out, dir.path(), "competitors.json", "nickname");
    assert!(
        line.contains(": record a: unknown field `nickname`"),
        "{line}"
    );
    assert!(line.contains("competitors.json:2:"), "{line}");
    assert!(
        there.starts_with("\"nickname\": \"Ace\""),
        "{line} points at {there:?}"
    );
    let (line, there) = located(&out, dir.path(), "competitors.json", "invalid type");
    assert!(
        line.contains(": record c: invalid type: integer `7`, expected a string"),
        "{line}"
    );
    assert!(there.starts_with("7,"), "{line} points at {there:?}");
    let (line, there) = located(&out, dir.path(), "sports.json", "expected an array");
    assert!(line.contains("sports.json:1:1:"), "{line}");
    assert!(there.starts_with('{'), "{there:?}");
}

#[test]
fn a_folder_of_batches_is_checked_against_its_scenario_with_places() {
    let good = r#"{"as_of": "2027-08-14T21:30:00+01:00", "changes": [
  {"change": "aliases", "of": "competitor", "id": "p036", "add": ["the Harbour Hare"]}
]}
"#;
    let refused = r#"{"as_of": "2027-08-14T21:40:00+01:00", "changes": [
  {"change": "schedule", "contest": "no-such-race", "venue": "Nowhere"},
  {"change": "results", "contest": "ath-m-marathon-final", "status": "final",
   "entries": [{"competitor": "p036", "place": 1, "mark": "slow", "award": "gold"}]}
]}
"#;
    let unreadable = "{\"changes\": [\n  {\"change\": \"results\", \"contest\": \"x\", \"status\": \"done\"},\n  {\"change\": \"renamed\"}\n]}\n";
    let dir = data_with_texts(&[
        ("replay/01.json", good),
        ("replay/02.json", refused),
        ("replay/03.json", unreadable),
        ("replay/04.json", "{\"changes\": [}\n"),
    ]);
    let replay = dir.path().join("replay");
    let (code, out) = check(&[replay.to_str().unwrap()]);
    assert_eq!(code, 1, "{out}");
    let (line, there) = located(&out, &replay, "02.json", "no-such-race");
    assert!(line.contains(": record change 1: field contest:"), "{line}");
    assert!(
        there.starts_with("\"no-such-race\""),
        "{line} points at {there:?}"
    );
    // A problem the records' check finds is placed in the change that made it.
    let (line, there) = located(&out, &replay, "02.json", "field mark");
    assert!(
        line.contains("record change 2 (contests.json ath-m-marathon-final entry 1)"),
        "{line}"
    );
    assert!(there.starts_with("\"slow\""), "{line} points at {there:?}");
    // Every change that does not fit the format, each at its place.
    let (line, there) = located(&out, &replay, "03.json", "unknown variant `done`");
    assert!(line.contains(": record change 1:"), "{line}");
    assert!(there.starts_with("\"done\""), "{line} points at {there:?}");
    let (line, _) = located(&out, &replay, "03.json", "unknown variant `renamed`");
    assert!(line.contains("03.json:3:"), "{line}");
    let (line, _) = located(&out, &replay, "04.json", "expected value");
    assert!(line.contains("04.json:1:14:"), "{line}");
    // The batch that checks out is not reported; a single batch file is
    // checked with its folder.
    assert!(!out.contains("01.json"), "{out}");
    // The election night as shipped applies batch after batch.
    let shipped = Path::new(env!("CARGO_MANIFEST_DIR")).join("dataset-demo/election/replay");
    let (code, clean) = check(&[shipped.to_str().unwrap()]);
    assert_eq!(code, 0, "{clean}");
    let (code, again) = check(&[replay.join("01.json").to_str().unwrap()]);
    assert_eq!(code, 1);
    assert_eq!(again, out);
}
