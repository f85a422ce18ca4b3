//! `tidings test` through the real binary: the project's own conversation
//! scripts pass, and a failing or broken script is reported readably with
//! exit code 1.

use std::process::Command;

fn tidings_test(args: &[&str]) -> (i32, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_tidings"))
        .arg("test")
        .args(args)
        .current_dir(env!("CARGO_MANIFEST_DIR"))
        .output()
        .expect("tidings runs");
    let text =
        String::from_utf8_lossy(&out.stdout).to_string() + &String::from_utf8_lossy(&out.stderr);
    (out.status.code().unwrap_or(-1), text)
}

/// `tidings test` on the election scenario and intents.
fn tidings_test_election(args: &[&str]) -> (i32, String) {
    let mut all = vec![
        "--data",
        "dataset-demo/election",
        "--intents",
        "intents/election",
    ];
    all.extend_from_slice(args);
    tidings_test(&all)
}

fn temp_script(name: &str, text: &str) -> std::path::PathBuf {
    let dir = std::env::temp_dir().join(format!(
        "tidings-scripts-{}-{:08x}",
        std::process::id(),
        rand::random::<u32>()
    ));
    std::fs::create_dir_all(&dir).unwrap();
    let p = dir.join(name);
    std::fs::write(&p, text).unwrap();
    p
}

#[test]
fn the_projects_own_scripts_pass() {
    let (code, out) = tidings_test(&["tests/scripts"]);
    assert_eq!(code, 0, "{out}");
    assert!(out.contains("0 failing"), "{out}");
    // A folder is read one level deep: the election scripts, written for
    // another scenario, are not played against the games.
    assert!(!out.contains("election"), "{out}");
}

/// The election scripts run on the election scenario as loaded, at the
/// start of the night (its own clock, 22:00 on 6 May: nothing counted yet).
#[test]
fn the_election_scripts_pass_on_the_election_scenario() {
    let (code, out) = tidings_test_election(&[
        "--now",
        "2027-05-06T22:00:00+01:00",
        "tests/scripts/election",
    ]);
    assert_eq!(code, 0, "{out}");
    assert!(out.contains("0 failing"), "{out}");
    let scripts = std::fs::read_dir(
        std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/scripts/election"),
    )
    .unwrap()
    .filter(|e| {
        e.as_ref()
            .unwrap()
            .path()
            .extension()
            .is_some_and(|x| x == "yaml")
    })
    .count();
    assert!(scripts >= 2, "the election scripts are there: {scripts}");
    assert!(
        out.contains(&format!("{scripts} script(s)")),
        "every election script ran: {out}"
    );
}

/// The league scripts run on the league demo at its own clock (matchday
/// 13 under way).
#[test]
fn the_league_scripts_pass_on_the_league_scenario() {
    let (code, out) = tidings_test(&[
        "--data",
        "dataset-demo/league",
        "--intents",
        "intents/league",
        "tests/scripts/league",
    ]);
    assert_eq!(code, 0, "{out}");
    assert!(out.contains("0 failing"), "{out}");
    assert!(out.contains("1 script(s)"), "{out}");
}

#[test]
fn a_failing_turn_shows_what_was_expected_and_what_came() {
    let p = temp_script(
        "wrong.yaml",
        "- conversation:\n    - ask: \"who won the men's 400 m?\"\n      says: [\"Larrel Trilunick\"]\n    - ask: \"and silver?\"\n      intent: podium\n      says: [\"Larrel Trilunick\"]\n",
    );
    let (code, out) = tidings_test(&[p.to_str().unwrap()]);
    assert_eq!(code, 1, "{out}");
    assert!(out.contains("FAIL"), "{out}");
    assert!(out.contains("\"and silver?\""), "{out}");
    assert!(out.contains("expected podium, got medalist"), "{out}");
    assert!(out.contains("lacks \"Larrel Trilunick\""), "{out}");
    assert!(out.contains("Nulan Bendand"), "the reply is shown: {out}");
}

#[test]
fn a_broken_script_is_located_and_fails_the_run() {
    let p = temp_script("broken.yaml", "- ask: \"hello\"\n  sayz: [\"Hello\"]\n");
    let (code, out) = tidings_test(&[p.to_str().unwrap()]);
    assert_eq!(code, 1, "{out}");
    assert!(out.contains("broken.yaml:2:"), "{out}");
    let (code, out) = tidings_test(&["no/such/folder"]);
    assert_eq!(code, 1);
    assert!(out.contains("no such file or folder"), "{out}");
}

/// Scripts for a moment of the night: `tidings test` applies the replay's
/// batches up to `--until` first, as the service had them then.
#[test]
fn scripts_run_at_a_moment_of_the_replayed_night() {
    let (code, out) = tidings_test_election(&[
        "--replay",
        "dataset-demo/election/replay",
        "--until",
        "2027-05-07T01:45:00+01:00",
        "tests/scripts/election-0145",
    ]);
    assert_eq!(code, 0, "{out}");
    assert!(out.contains("1 script(s), 8 turn(s), 0 failing"), "{out}");
    // The same scripts at the start of the night fail: the answers really
    // come from the replayed state.
    let (code, out) = tidings_test_election(&["tests/scripts/election-0145"]);
    assert_eq!(code, 1, "{out}");
    // A refused batch stops the command with the file and its problem.
    let dir = std::env::temp_dir().join(format!("tidings-replay-bad-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    std::fs::write(
        dir.join("01.json"),
        r#"{"changes": [{"change": "results", "contest": "nowhere", "status": "live"}]}"#,
    )
    .unwrap();
    let (code, out) = tidings_test_election(&[
        "--replay",
        dir.to_str().unwrap(),
        "tests/scripts/election-0145",
    ]);
    std::fs::remove_dir_all(&dir).unwrap();
    assert_ne!(code, 0, "{out}");
    assert!(out.contains("01.json") && out.contains("nowhere"), "{out}");
}
