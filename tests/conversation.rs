//! Multi-turn conversations through the HTTP API, each run twice: with
//! sessions in memory and with sessions in the private test Redis.

mod common;

use std::sync::Arc;

use common::{engine_with, post_message, redis_engine, test_prefix, test_settings, Server};
use tidings::dialogue::MemoryStore;

/// One reader's conversation: each message and words its reply must hold.
async fn talk(s: &Server, user: &str, turns: &[(&str, &[&str])]) -> Vec<serde_json::Value> {
    let mut out = Vec::new();
    for (text, wanted) in turns {
        let (status, body, _) = post_message(s, user, text, None).await;
        assert_eq!(status, 200, "{text}: {body}");
        let reply = body["text"].as_str().unwrap_or_default();
        for w in *wanted {
            assert!(reply.contains(w), "{text:?} → {reply:?} lacks {w:?}");
        }
        assert_eq!(body["degraded"], false, "{body}");
        out.push(body);
    }
    out
}

async fn ellipsis(s: &Server) {
    let r = talk(
        s,
        "reader-ellipsis",
        &[
            ("who won the men's 400 m?", &["Larrel Trilunick"]),
            ("and silver?", &["Nulan Bendand", "silver", "men's 400 m"]),
            (
                "what about the women's?",
                &["Vonia Gassarace", "women's 400 m"],
            ),
        ],
    )
    .await;
    assert_eq!(r[1]["slots"]["award"]["value"], "silver");
    assert_eq!(r[2]["slots"]["contest"]["value"], "ath-w-400m-final");
    // A round changed on its own: "and in the final?" after a heat.
    talk(
        s,
        "reader-rounds",
        &[
            (
                "who won the women's 100 m heat 1?",
                &["Anaïs Cordvelle", "No medals"],
            ),
            (
                "and in the final?",
                &["women's 100 m final", "not started yet"],
            ),
        ],
    )
    .await;
}

async fn entity_switch(s: &Server) {
    let r = talk(
        s,
        "reader-switch",
        &[
            (
                "how many medals does Quessary have?",
                &["Quessary", "10 medals"],
            ),
            ("how about Sordavia?", &["Sordavia", "four medals"]),
        ],
    )
    .await;
    assert_eq!(r[1]["intent"], "delegation_medals");
    assert!(!r[1]["text"].as_str().unwrap().contains("Quessary"));
}

async fn pronouns(s: &Server) {
    talk(
        s,
        "reader-she",
        &[
            (
                "who won the women's 100 m freestyle?",
                &["Pevelle Cosevmont"],
            ),
            (
                "when does she race next?",
                &["Pevelle Cosevmont", "women's 400 m individual medley"],
            ),
        ],
    )
    .await;
    // "that" ending a question is whoever the last answer was about.
    let r = talk(
        s,
        "reader-that",
        &[
            (
                "who won the women's 100 m freestyle?",
                &["Pevelle Cosevmont"],
            ),
            (
                "which delegation is that?",
                &["Pevelle Cosevmont", "Vastrelia"],
            ),
        ],
    )
    .await;
    assert_eq!(r[1]["intent"], "competitor_delegation", "{}", r[1]);
    // So is a side asked for with no one named.
    let r = talk(
        s,
        "reader-which",
        &[
            (
                "who won the women's 100 m freestyle?",
                &["Pevelle Cosevmont"],
            ),
            ("and which delegation?", &["Pevelle Cosevmont", "Vastrelia"]),
        ],
    )
    .await;
    assert_eq!(r[1]["intent"], "competitor_delegation", "{}", r[1]);
    // Two women just named: "she" is unclear, so the reader is asked.
    let r = talk(
        s,
        "reader-unclear",
        &[
            (
                "did Pevelle Cosevmont beat Zoë Quillon in the women's 100 m freestyle?",
                &["Pevelle Cosevmont finished ahead of Zoë Quillon"],
            ),
            (
                "when does she compete next?",
                &["Pevelle Cosevmont", "Zoë Quillon"],
            ),
            ("the second one", &["Zoë Quillon", "tomorrow at 18:30"]),
        ],
    )
    .await;
    assert_eq!(r[1]["outcome"], "clarify");
    assert_eq!(r[1]["options"].as_array().unwrap().len(), 2);
    // No context at all: the pronoun cannot be resolved, so ask.
    let r = talk(
        s,
        "reader-fresh",
        &[("when does he race next?", &["Which athlete"])],
    )
    .await;
    assert_eq!(r[0]["outcome"], "clarify");
}

async fn clarification_answers(s: &Server) {
    for (user, answer) in [
        ("reader-pick-name", "Zoë Quillon"),
        ("reader-pick-part", "Quillon"),
        ("reader-pick-position", "the first one"),
        ("reader-pick-noun", "the swimmer"),
        ("reader-pick-group", "the one from Quessary"),
    ] {
        let r = talk(
            s,
            user,
            &[
                ("when does Zoe compete next?", &["Which person"]),
                (answer, &["Zoë Quillon", "tomorrow at 18:30"]),
            ],
        )
        .await;
        assert_eq!(r[1]["slots"]["competitor"]["value"], "p196", "{answer}");
    }
    // Something unrelated is a new question; the pending one is dropped.
    let r = talk(
        s,
        "reader-unrelated",
        &[
            ("when does Zoe compete next?", &["Which person"]),
            ("who leads the medal table?", &["Kalvenmark"]),
            ("the rower", &[]),
        ],
    )
    .await;
    assert_eq!(r[1]["intent"], "medal_table_leader");
    assert!(!r[2]["text"].as_str().unwrap().contains("Zoë Marrant"));
}

async fn resets(s: &Server) {
    for reset in ["start over", "never mind"] {
        let user = format!("reader-reset-{reset}");
        let r = talk(
            s,
            &user,
            &[
                (
                    "who won the women's 100 m freestyle?",
                    &["Pevelle Cosevmont"],
                ),
                (reset, &[]),
                ("and silver?", &["Which event"]),
            ],
        )
        .await;
        assert_eq!(r[2]["outcome"], "clarify", "{reset}");
        assert!(!r[2]["text"].as_str().unwrap().contains("Zoë Quillon"));
    }
}

/// Context fills gaps only where it is certain; otherwise the reader is
/// asked. Each case once gave a wrong or invented fact.
async fn context_never_invents(s: &Server) {
    // One woman in mind, two slots: not a tie of her with herself.
    let r = talk(
        s,
        "reader-she-her",
        &[
            ("who won the women's 400m?", &["Rasaline Rentenert"]),
            ("did she beat her?", &[]),
        ],
    )
    .await;
    assert_eq!(r[1]["outcome"], "clarify", "{}", r[1]);
    assert!(!r[1]["text"]
        .as_str()
        .unwrap()
        .contains("could not be separated"));
    // "she" after a man: ask, never answer about him.
    let r = talk(
        s,
        "reader-she-him",
        &[
            ("how did Trilunick do in the 400m?", &["Larrel Trilunick"]),
            ("when does she race next?", &["Which athlete"]),
        ],
    )
    .await;
    assert!(!r[1]["text"].as_str().unwrap().contains("Trilunick"));
    // A pronoun means the last answer's people, not an older turn's.
    talk(
        s,
        "reader-latest",
        &[
            ("who won the women's 400m?", &["Rasaline Rentenert"]),
            (
                "who won gold in the women's all-around?",
                &["Krundena Dovonasko"],
            ),
            ("when does she compete next?", &["Krundena Dovonasko"]),
        ],
    )
    .await;
    let r = talk(
        s,
        "reader-they",
        &[
            ("how many medals has Kalvenmark won?", &["Kalvenmark"]),
            ("who won the men's 400m?", &["Larrel Trilunick"]),
            ("how many medals have they won?", &["Which delegation"]),
        ],
    )
    .await;
    assert_eq!(r[2]["outcome"], "clarify");
    // A shared silver: "she" could be either, so ask.
    talk(
        s,
        "reader-shared",
        &[
            (
                "who won silver in the women's 200m freestyle?",
                &["Zoë Quillon", "Hurra Brussand"],
            ),
            (
                "how many medals has she won?",
                &["Zoë Quillon", "Hurra Brussand", "Which"],
            ),
        ],
    )
    .await;
    // A new question is not taken as the answer to a pending one.
    talk(
        s,
        "reader-pending",
        &[
            ("who won the 200m?", &["Which event"]),
            (
                "who was first in the men's 400m?",
                &["Larrel Trilunick", "men's 400 m"],
            ),
        ],
    )
    .await;
    // A whole new question keeps nothing of the last one (not the medal).
    let r = talk(
        s,
        "reader-whole",
        &[
            ("who won the men's 400m?", &["Larrel Trilunick"]),
            ("and silver?", &["Nulan Bendand"]),
            (
                "and who won the men's 200m?",
                &["Wonorin Galkace", "won the men's 200 m, with"],
            ),
        ],
    )
    .await;
    assert!(!r[2]["text"].as_str().unwrap().contains("silver in"));
    // A sport on its own changes the event: which one is asked.
    let r = talk(
        s,
        "reader-sport",
        &[
            ("who is leading the men's high jump?", &["Lomov Kerreth"]),
            ("how about gymnastics?", &["Which event"]),
        ],
    )
    .await;
    assert!(!r[1]["text"].as_str().unwrap().contains("high jump"));
    // They met in the 400 m, not in the 200 m: never "have not met".
    talk(
        s,
        "reader-met",
        &[
            (
                "did Trilunick beat Bendand in the 400m?",
                &["Larrel Trilunick finished ahead"],
            ),
            (
                "and in the 200m?",
                &["did not both compete in the men's 200 m"],
            ),
        ],
    )
    .await;
}

macro_rules! on_both_stores {
    ($($name:ident),* $(,)?) => {
        mod in_memory {
            use super::*;
            $(
                #[tokio::test]
                async fn $name() {
                    let s = Server::start(engine_with(Arc::new(MemoryStore::new()), test_settings())).await;
                    super::$name(&s).await;
                }
            )*
        }
        mod in_redis {
            use super::*;
            $(
                #[tokio::test]
                async fn $name() {
                    let (engine, _) = redis_engine(&test_prefix(stringify!($name)));
                    let s = Server::start(engine).await;
                    super::$name(&s).await;
                }
            )*
        }
    };
}

on_both_stores!(
    ellipsis,
    entity_switch,
    pronouns,
    clarification_answers,
    resets,
    context_never_invents
);
