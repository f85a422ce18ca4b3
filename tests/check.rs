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

#[test]
fn data_problems_name_file_record_and_field() {
    // A dangling reference.
    let dir = data_with("competitors.json", |mut v| {
        v[0]["group"] = "nowhere".into();
        v
    });
    let (code, out) = check(&["--data", dir.path().to_str().unwrap()]);
    assert_eq!(code, 1);
    assert!(
        out.contains("competitors.json: record p001: field group: no group with id \"nowhere\""),
        "{out}"
    );

    // A duplicate id and a mark that does not parse for its measure.
    let dir = data_with("contests.json", |mut v| {
        let first = v[0].clone();
        v.as_array_mut().unwrap().push(first);
        v[1]["entries"][0]["mark"] = "fast".into();
        v
    });
    let (code, out) = check(&["--data", dir.path().to_str().unwrap()]);
    assert_eq!(code, 1);
    assert!(out.contains("field id: duplicate id"), "{out}");
    assert!(out.contains("field mark:"), "{out}");
}

#[test]
fn an_alias_that_is_also_a_delegations_name_is_reported() {
    let dir = data_with("competitors.json", |mut v| {
        v[0]["aliases"] = serde_json::json!(["quessary"]);
        v
    });
    let (code, out) = check(&["--data", dir.path().to_str().unwrap()]);
    assert_eq!(code, 1);
    assert!(
        out.contains("competitors.json: record p001: field aliases: alias \"quessary\" is also a name of group"),
        "{out}"
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
