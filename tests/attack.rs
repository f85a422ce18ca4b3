//! `tools/attack.py` in its quick mode against the real binary: the script
//! runs, its figures parse, and every protection it probes holds — slow
//! connections closed by their timeouts while a normal client is served,
//! connections past the cap refused with a JSON 503 and a log line, a
//! half-sent header not holding up SIGTERM, a flood from one address
//! limited without touching another client, a burst of one reader
//! answered in line, and no personal data kept on the unanswered list.
//! Each check fails if its protection is taken out.

use std::process::Command;

use serde_json::Value;

fn run_attack() -> (i32, String, Value) {
    let mut cmd = Command::new("python3");
    cmd.arg("tools/attack.py")
        .args(["--quick", "--bin", env!("CARGO_BIN_EXE_tidings")])
        .current_dir(env!("CARGO_MANIFEST_DIR"));
    if let Ok(bin) = std::env::var("TIDINGS_REDIS_SERVER_BIN") {
        cmd.args(["--redis-server", &bin]);
    }
    let out = cmd.output().expect("python3 runs");
    let text =
        String::from_utf8_lossy(&out.stdout).to_string() + &String::from_utf8_lossy(&out.stderr);
    let figures = text
        .lines()
        .rev()
        .find_map(|l| l.strip_prefix("FIGURES "))
        .unwrap_or_else(|| panic!("no FIGURES line:\n{text}"));
    let figures: Value = serde_json::from_str(figures)
        .unwrap_or_else(|e| panic!("the FIGURES line is not JSON ({e}):\n{text}"));
    (out.status.code().unwrap_or(-1), text, figures)
}

#[test]
fn the_quick_attack_finds_every_protection_in_place() {
    let (code, text, f) = run_attack();
    let n = |v: &Value| {
        v.as_u64()
            .unwrap_or_else(|| panic!("not a count: {v}\n{text}"))
    };

    let slow = &f["slow"];
    let (drip, silent) = (&slow["dripping"], &slow["silent"]);
    assert!(n(&drip["count"]) > 0 && n(&silent["count"]) > 0, "{text}");
    assert_eq!(
        drip["closed"], drip["count"],
        "byte-a-second connections left open\n{text}"
    );
    assert_eq!(drip["by_header_timeout"], drip["count"], "{text}");
    assert_eq!(n(&drip["answered"]), 0, "{text}");
    assert_eq!(
        silent["closed"], silent["count"],
        "silent connections left open\n{text}"
    );
    assert_eq!(silent["by_idle_timeout"], silent["count"], "{text}");
    let during = &slow["normal_during"];
    assert!(n(&during["requests"]) > 0, "{text}");
    assert_eq!(
        during["ok"], during["requests"],
        "the normal client was not served\n{text}"
    );

    let cap = &f["cap"];
    assert_eq!(cap["refused_503"], cap["extra"], "{text}");
    assert_eq!(cap["json_503"], cap["extra"], "{text}");
    assert_eq!(cap["codes"]["too_many_connections"], cap["extra"], "{text}");
    assert!(
        n(&cap["warn_lines"]) >= 1,
        "no log line for the refusals\n{text}"
    );
    assert_eq!(cap["served_after"], true, "{text}");

    let term = &f["sigterm"];
    assert_eq!(term["exit_code"], 0, "{text}");
    let limit = term["drain_timeout_s"].as_f64().unwrap() + 2.0;
    assert!(
        term["exit_s"].as_f64().unwrap() <= limit,
        "SIGTERM waited on the half-sent header\n{text}"
    );

    let flood = &f["flood"];
    let flooder = &flood["flooder"];
    assert!(
        n(&flooder["status_429"]) > 0,
        "the flood was not limited\n{text}"
    );
    assert_eq!(flooder["with_retry_after"], flooder["status_429"], "{text}");
    assert_eq!(n(&flooder["other"]), 0, "{text}");
    let victim = &flood["victim_during"];
    assert!(n(&victim["requests"]) > 0, "{text}");
    assert_eq!(
        victim["ok"], victim["requests"],
        "the other client was turned away\n{text}"
    );

    let burst = &f["burst"];
    let defaults = &burst["defaults"];
    assert_eq!(
        n(&defaults["status_503"]) + n(&defaults["other"]),
        0,
        "{text}"
    );
    assert_eq!(
        defaults["retry_after_on_429"], defaults["status_429"],
        "{text}"
    );
    for r in ["no_ids", "ids"] {
        let r = &burst["in_line"][r];
        assert_eq!(r["answered"], burst["messages"], "{text}");
        // Waiting in line costs Redis no more per message than a message
        // alone, message ids (kept replies) or not.
        let per_message = r["commands_per_answered"].as_f64().unwrap();
        let alone = r["single_message_commands"].as_f64().unwrap();
        assert!(per_message <= alone * 1.1 + 0.5, "{text}");
    }

    let pii = &f["pii"];
    // Most probes must reach the list, or the check below would prove
    // nothing (identical masked texts are one row).
    assert!(
        n(&pii["kept_rows"]) * 2 >= n(&pii["probes"]),
        "the probes did not reach the unanswered list\n{text}"
    );
    assert_eq!(n(&pii["survivors"]), 0, "personal data kept\n{text}");

    assert_eq!(code, 0, "{text}");
}
