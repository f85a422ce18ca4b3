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
