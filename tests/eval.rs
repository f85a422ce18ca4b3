//! The labelled question set must meet its targets: intent accuracy at
//! least 0.97, slot micro-F1 at least 0.95, wrong-answer rate at most 0.5%.

mod common;

use std::path::Path;

#[tokio::test]
async fn the_demo_question_set_meets_its_targets() {
    let set = Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/eval/games.yaml");
    let cases = tidings::eval::load_set(&set).expect("the question set parses");
    let singles = cases
        .iter()
        .filter(|c| matches!(c, tidings::eval::Case::Single(_)))
        .count();
    let conversations = cases.len() - singles;
    assert!(singles >= 250, "at least 250 questions, found {singles}");
    assert!(
        conversations >= 40,
        "at least 40 conversations, found {conversations}"
    );
    let engine = common::demo_engine();
    let r = tidings::eval::evaluate(&engine, &cases).await;
    let failures: Vec<String> = r
        .failures
        .iter()
        .map(|f| {
            format!(
                "case {} {:?}: {} => {}",
                f.case,
                f.ask,
                f.problems.join("; "),
                f.reply
            )
        })
        .collect();
    assert!(
        r.meets_targets(),
        "intent {:.4}, slot F1 {:.4}, wrong-answer rate {:.4}\n{}",
        r.intent_accuracy,
        r.slot_f1,
        r.wrong_answer_rate,
        failures.join("\n")
    );
}
