//! Conversation scripts: editors' own tests, run by `tidings test`.
//!
//! A script is a YAML file in the evaluation-set format (`docs/eval.md`):
//! single questions and multi-turn conversations, each turn with what its
//! reply must show (intent, slots, outcome, phrases it says or never
//! says). Unlike `tidings eval`, which measures rates against targets, a
//! script passes only when every turn does, and a failing turn is printed
//! as expected-against-got with the reply.

use std::path::{Path, PathBuf};
use std::time::Duration;

use crate::cli::Common;
use crate::eval::{evaluate, load_set};

/// The YAML files at `paths` (files as given, folders searched one level).
fn script_files(paths: &[PathBuf]) -> Result<Vec<PathBuf>, String> {
    let mut out = Vec::new();
    for p in paths {
        if p.is_dir() {
            let mut found: Vec<PathBuf> = std::fs::read_dir(p)
                .map_err(|e| format!("{}: cannot read the folder: {e}", p.display()))?
                .flatten()
                .map(|e| e.path())
                .filter(|f| f.extension().is_some_and(|x| x == "yaml" || x == "yml"))
                .collect();
            found.sort();
            out.extend(found);
        } else if p.exists() {
            out.push(p.clone());
        } else {
            return Err(format!("{}: no such file or folder", p.display()));
        }
    }
    if out.is_empty() {
        return Err("no conversation scripts found (YAML files)".into());
    }
    Ok(out)
}

/// Runs the scripts; returns the exit code: 0 when every turn passes, 1
/// otherwise (or when a script cannot be read).
pub async fn run(common: &Common, paths: &[PathBuf]) -> i32 {
    let files = match script_files(paths) {
        Ok(f) => f,
        Err(e) => {
            eprintln!("{e}");
            return 1;
        }
    };
    let engine = match crate::cli::local_engine(common, Duration::from_secs(3600)) {
        Ok(e) => e,
        Err(e) => {
            eprintln!("{e}");
            return 1;
        }
    };
    let (mut turns, mut failing, mut broken) = (0, 0, 0);
    for file in &files {
        let cases = match load_set(file) {
            Ok(c) => c,
            Err(e) => {
                println!("{e}");
                broken += 1;
                continue;
            }
        };
        if cases.is_empty() {
            println!(
                "{}: no cases: a script needs at least one question",
                shown(file)
            );
            broken += 1;
            continue;
        }
        let r = evaluate(&engine, &cases).await;
        turns += r.turns;
        failing += r.failures.len();
        let name = shown(file);
        if r.failures.is_empty() {
            println!("ok    {name}: {} case(s), {} turn(s)", r.cases, r.turns);
            continue;
        }
        println!(
            "FAIL  {name}: {} of {} turn(s) failed",
            r.failures.len(),
            r.turns
        );
        for f in &r.failures {
            println!("  case {}, {:?}", f.case, f.ask);
            for p in &f.problems {
                println!("    - {p}");
            }
            println!("    reply: {:?}", f.reply);
        }
    }
    println!(
        "{} script(s), {turns} turn(s), {failing} failing{}",
        files.len(),
        if broken > 0 {
            format!(", {broken} unreadable")
        } else {
            String::new()
        }
    );
    i32::from(failing > 0 || broken > 0)
}

fn shown(p: &Path) -> String {
    p.display().to_string()
}
