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
    resets
);
