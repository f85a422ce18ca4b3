//! Measuring quality on a labelled question set: intent accuracy, slot
//! micro-F1, answer accuracy and the wrong-answer rate.
//!
//! A set is YAML: a list of cases, each either one question or a
//! conversation of several turns. Each turn may say which intent and slots
//! it expects, the reply's outcome, and phrases the reply must (`says`) or
//! must not (`never`) contain. See `docs/eval.md`.
//!
//! Slot F1 follows the chunk-level definition used for CoNLL-2000: a
//! predicted (slot, value) pair counts only if it matches an expected pair
//! exactly; precision and recall are pooled over all turns (micro average).

use std::collections::BTreeMap;
use std::path::Path;
use std::time::Duration;

use serde::{Deserialize, Serialize};

use crate::cli::Common;
use crate::dialogue::Outcome;
use crate::engine::Engine;
use crate::understand::frame::Focus;

/// One labelled turn.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Turn {
    pub ask: String,
    /// Expected intent; `none` when the message should not be understood.
    #[serde(default)]
    pub intent: Option<String>,
    /// Expected slots by name: entity ids, ISO 8601 dates, numbers.
    #[serde(default)]
    pub slots: Option<BTreeMap<String, String>>,
    #[serde(default)]
    pub outcome: Option<Outcome>,
    /// What the question asks for (`who`, `count`, `margin`...; the values
    /// are in docs/intents.md). A reply whose intent does not declare
    /// this focus among those it answers answers a different question:
    /// with outcome `answered` it counts as a wrong answer even when every
    /// fact in it is true.
    #[serde(default)]
    pub focus: Option<String>,
    /// Phrases the reply must contain (case-insensitive).
    #[serde(default)]
    pub says: Vec<String>,
    /// Phrases the reply must not contain.
    #[serde(default)]
    pub never: Vec<String>,
    /// Labels for reporting ("misspelling", "ambiguous"...).
    #[serde(default)]
    pub tags: Vec<String>,
}

/// A case: one question, or a conversation. Unknown keys are an error in
/// both, so a typo such as `say:` cannot silently turn a check off.
#[derive(Debug, Clone, Deserialize)]
#[serde(untagged)]
pub enum Case {
    Conversation {
        conversation: Vec<Turn>,
        #[serde(default)]
        tags: Vec<String>,
    },
    Single(Turn),
}

/// A turn that did not meet its labels.
#[derive(Debug, Clone, Serialize)]
pub struct Failure {
    pub case: usize,
    pub ask: String,
    pub problems: Vec<String>,
    pub reply: String,
    /// Whether the reply was a confident answer with a wrong fact or to
    /// another question (counted in `wrong_answers`).
    pub wrong: bool,
}

/// The figures.
#[derive(Debug, Clone, Default, Serialize)]
pub struct Report {
    pub cases: usize,
    pub turns: usize,
    pub conversations: usize,
    pub intent_total: usize,
    pub intent_correct: usize,
    pub intent_accuracy: f64,
    pub slot_precision: f64,
    pub slot_recall: f64,
    pub slot_f1: f64,
    pub answer_total: usize,
    pub answer_correct: usize,
    pub answer_accuracy: f64,
    /// Confident answers (outcome answered) with a wrong fact, over all turns.
    pub wrong_answers: usize,
    pub wrong_answer_rate: f64,
    /// Answers whose focus differs from the labelled one (included in
    /// `wrong_answers`).
    pub wrong_focus: usize,
    /// Confident answers whose reply lacks a labelled fact or holds a
    /// forbidden one: a wrong or missing fact for the reader, whatever
    /// intent gave it (included in `wrong_answers`).
    pub wrong_facts: usize,
    /// The same figures for the turns carrying each tag (a conversation's
    /// tags count for each of its turns).
    pub by_tag: BTreeMap<String, TagFigures>,
    pub failures: Vec<Failure>,
}

/// Figures for the turns of one tag.
#[derive(Debug, Clone, Default, Serialize)]
pub struct TagFigures {
    pub turns: usize,
    pub intent_total: usize,
    pub intent_correct: usize,
    pub answer_total: usize,
    pub answer_correct: usize,
    pub wrong_answers: usize,
}

/// Targets for the demo set.
pub const TARGETS: [(&str, f64); 3] = [
    ("intent_accuracy", 0.97),
    ("slot_f1", 0.95),
    ("wrong_answer_rate_max", 0.005),
];

impl Report {
    /// Whether the figures meet [`TARGETS`].
    pub fn meets_targets(&self) -> bool {
        self.intent_accuracy >= TARGETS[0].1
            && self.slot_f1 >= TARGETS[1].1
            && self.wrong_answer_rate <= TARGETS[2].1
    }
}

/// Reads a question set.
pub fn load_set(path: &Path) -> Result<Vec<Case>, String> {
    let text = std::fs::read_to_string(path)
        .map_err(|e| format!("{}: cannot read: {e}", path.display()))?;
    serde_saphyr::from_str(&text).map_err(|e| {
        // A case is a question or a conversation, so a mistake inside one
        // only shows as "matches neither" at the case's start. Reading the
        // file as all questions and as all conversations says what is
        // wrong, and where: the reading that got furthest is reported.
        let at = |e: &serde_saphyr::Error| {
            e.location()
                .map(|l| (l.line(), l.column()))
                .unwrap_or((0, 0))
        };
        let mut best = (at(&e), e.to_string());
        let tries = [
            serde_saphyr::from_str::<Vec<Turn>>(&text).err(),
            serde_saphyr::from_str::<Vec<ConversationCase>>(&text).err(),
        ];
        for t in tries.into_iter().flatten() {
            if at(&t) > best.0 {
                best = (at(&t), t.to_string());
            }
        }
        let ((l, c), message) = best;
        format!(
            "{}:{l}:{c}: {}",
            path.display(),
            message.lines().next().unwrap_or("invalid YAML")
        )
    })
}

/// A conversation on its own, to locate mistakes inside one.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
#[allow(dead_code)] // read only for its error messages
struct ConversationCase {
    conversation: Vec<Turn>,
    #[serde(default)]
    tags: Vec<String>,
}

/// Runs every case through the engine; each case is a fresh reader.
pub async fn evaluate(engine: &Engine, cases: &[Case]) -> Report {
    let mut r = Report {
        cases: cases.len(),
        ..Report::default()
    };
    let (mut tp, mut fp, mut fn_) = (0usize, 0usize, 0usize);
    let snapshot = engine.snapshot();
    for (ci, case) in cases.iter().enumerate() {
        let (turns, case_tags): (&[Turn], &[String]) = match case {
            Case::Single(turn) => (std::slice::from_ref(turn), &[]),
            Case::Conversation { conversation, tags } => {
                r.conversations += 1;
                (conversation, tags)
            }
        };
        let user = format!("eval-{ci}");
        for t in turns {
            r.turns += 1;
            let mut tags: Vec<&String> = case_tags.iter().chain(&t.tags).collect();
            tags.sort();
            tags.dedup();
            for tag in &tags {
                r.by_tag.entry((*tag).clone()).or_default().turns += 1;
            }
            let answer = match engine.handle(&user, "chat", &t.ask).await {
                Ok(a) => a,
                Err(e) => {
                    r.failures.push(Failure {
                        case: ci + 1,
                        ask: t.ask.clone(),
                        problems: vec![e.to_string()],
                        reply: String::new(),
                        wrong: false,
                    });
                    continue;
                }
            };
            let reply = &answer.reply;
            let mut problems = Vec::new();
            let mut fact_wrong = false;
            let mut said_wrong = false;
            if let Some(want) = &t.intent {
                r.intent_total += 1;
                let got = reply.intent.clone().unwrap_or_else(|| "none".into());
                for tag in &tags {
                    let f = r.by_tag.entry((*tag).clone()).or_default();
                    f.intent_total += 1;
                    f.intent_correct += usize::from(&got == want);
                }
                if &got == want {
                    r.intent_correct += 1;
                } else {
                    problems.push(format!("intent: expected {want}, got {got}"));
                    fact_wrong = true;
                }
            }
            if let Some(want) = &t.slots {
                let got: BTreeMap<String, String> = reply
                    .slots
                    .iter()
                    .map(|(k, v)| (k.clone(), v.value.clone()))
                    .collect();
                for (k, v) in &got {
                    if want.get(k) == Some(v) {
                        tp += 1;
                    } else {
                        fp += 1;
                        problems.push(format!(
                            "slot {k}: got {v}, expected {}",
                            want.get(k).map(String::as_str).unwrap_or("nothing")
                        ));
                        fact_wrong = true;
                    }
                }
                for (k, v) in want {
                    if got.get(k) != Some(v) {
                        fn_ += 1;
                        if !got.contains_key(k) {
                            problems.push(format!("slot {k}: missing, expected {v}"));
                        }
                    }
                }
            }
            let mut answer_ok = true;
            if let Some(o) = t.outcome {
                if !outcome_meets(o, reply.outcome) {
                    problems.push(format!("outcome: expected {o:?}, got {:?}", reply.outcome));
                    answer_ok = false;
                }
            }
            let lower = reply.text.to_lowercase();
            for s in &t.says {
                if !lower.contains(&s.to_lowercase()) {
                    problems.push(format!("reply lacks {s:?}"));
                    answer_ok = false;
                    fact_wrong = true;
                    said_wrong = true;
                }
            }
            for s in &t.never {
                if lower.contains(&s.to_lowercase()) {
                    problems.push(format!("reply contains {s:?}"));
                    answer_ok = false;
                    fact_wrong = true;
                    said_wrong = true;
                }
            }
            let mut focus_wrong = false;
            if let (Some(want), Some(got)) = (&t.focus, &reply.focus) {
                // The reply names one focus, the one the question's frame
                // found; an intent that declares several answers each of
                // them ("is X ahead of Y" is a yes or no and a comparison,
                // and its reply gives both). So a reply answers another
                // question only when its intent does not answer the
                // labelled focus at all.
                let declared = Focus::ALL
                    .iter()
                    .find(|f| f.name() == want)
                    .is_some_and(|&f| {
                        reply
                            .intent
                            .as_deref()
                            .and_then(|i| snapshot.catalog.intent(i))
                            .is_some_and(|i| i.answers_focus(f))
                    });
                if want != got && !declared && reply.outcome == Outcome::Answered {
                    problems.push(format!("focus: expected {want}, answered {got}"));
                    focus_wrong = true;
                    answer_ok = false;
                }
            }
            let judged = t.outcome.is_some() || !t.says.is_empty() || !t.never.is_empty();
            if judged {
                r.answer_total += 1;
                if answer_ok {
                    r.answer_correct += 1;
                }
            }
            // Wrong-answer: the service answered with confidence, and the
            // answer's intent, slots or facts were wrong, or it answered
            // another question than the one asked (its focus differs).
            let wrong = reply.outcome == Outcome::Answered && (fact_wrong || focus_wrong);
            if wrong {
                r.wrong_answers += 1;
                r.wrong_focus += usize::from(focus_wrong && !fact_wrong);
                r.wrong_facts += usize::from(said_wrong);
            }
            for tag in &tags {
                let f = r.by_tag.entry((*tag).clone()).or_default();
                if judged {
                    f.answer_total += 1;
                    f.answer_correct += usize::from(answer_ok);
                }
                f.wrong_answers += usize::from(wrong);
            }
            if !problems.is_empty() {
                r.failures.push(Failure {
                    case: ci + 1,
                    ask: t.ask.clone(),
                    problems,
                    reply: reply.text.clone(),
                    wrong,
                });
            }
        }
    }
    let ratio = |a: usize, b: usize| if b == 0 { 1.0 } else { a as f64 / b as f64 };
    r.intent_accuracy = ratio(r.intent_correct, r.intent_total);
    r.slot_precision = ratio(tp, tp + fp);
    r.slot_recall = ratio(tp, tp + fn_);
    r.slot_f1 = if r.slot_precision + r.slot_recall == 0.0 {
        0.0
    } else {
        2.0 * r.slot_precision * r.slot_recall / (r.slot_precision + r.slot_recall)
    };
    r.answer_accuracy = ratio(r.answer_correct, r.answer_total);
    r.wrong_answer_rate = if r.turns == 0 {
        0.0
    } else {
        r.wrong_answers as f64 / r.turns as f64
    };
    r
}

/// Whether a reply's outcome meets the labelled one. A label of
/// `not_covered` or `not_understood` (the service should decline) is met
/// by either honest decline: neither asserts a fact. Every other label
/// must match exactly.
/// The figures by tag as a text table, tags in name order.
pub fn tag_table(r: &Report) -> String {
    let ratio = |a: usize, b: usize| {
        if b == 0 {
            "-".to_string()
        } else {
            format!("{:.3}", a as f64 / b as f64)
        }
    };
    let mut out = format!(
        "{:<18} {:>6} {:>8} {:>8} {:>7}\n",
        "tag", "turns", "intent", "answer", "wrong"
    );
    for (tag, f) in &r.by_tag {
        out.push_str(&format!(
            "{:<18} {:>6} {:>8} {:>8} {:>7}\n",
            tag,
            f.turns,
            ratio(f.intent_correct, f.intent_total),
            ratio(f.answer_correct, f.answer_total),
            f.wrong_answers
        ));
    }
    out
}

fn outcome_meets(want: Outcome, got: Outcome) -> bool {
    let declines = |o: Outcome| matches!(o, Outcome::NotCovered | Outcome::NotUnderstood);
    want == got || (declines(want) && declines(got))
}

/// `tidings eval`.
pub async fn run_cli(common: &Common, set: &Path, verbose: bool, json: bool, by_tag: bool) -> i32 {
    let engine = match crate::cli::local_engine(common, Duration::from_secs(3600)) {
        Ok(e) => e,
        Err(e) => {
            eprintln!("{e}");
            return 1;
        }
    };
    let cases = match load_set(set) {
        Ok(c) => c,
        Err(e) => {
            eprintln!("{e}");
            return 1;
        }
    };
    let r = evaluate(&engine, &cases).await;
    if json {
        println!("{}", serde_json::to_string_pretty(&r).unwrap_or_default());
    } else {
        if verbose {
            for f in &r.failures {
                println!(
                    "case {}{}: {:?}\n  reply: {}\n  {}",
                    f.case,
                    if f.wrong { " WRONG" } else { "" },
                    f.ask,
                    f.reply,
                    f.problems.join("\n  ")
                );
            }
        }
        println!(
            "cases {} ({} conversations), turns {}",
            r.cases, r.conversations, r.turns
        );
        println!(
            "intent accuracy   {:.4}  ({}/{})  target >= 0.97",
            r.intent_accuracy, r.intent_correct, r.intent_total
        );
        println!(
            "slot F1 (micro)   {:.4}  (precision {:.4}, recall {:.4})  target >= 0.95",
            r.slot_f1, r.slot_precision, r.slot_recall
        );
        println!(
            "answer accuracy   {:.4}  ({}/{})",
            r.answer_accuracy, r.answer_correct, r.answer_total
        );
        println!(
            "wrong-answer rate {:.4}  ({}/{}, {} of them a different question)  target <= 0.005",
            r.wrong_answer_rate, r.wrong_answers, r.turns, r.wrong_focus
        );
        println!(
            "  of which a fact missing or wrong in the reply: {}/{}",
            r.wrong_facts, r.turns
        );
        if by_tag {
            print!("{}", tag_table(&r));
        }
    }
    if r.meets_targets() {
        0
    } else {
        1
    }
}
