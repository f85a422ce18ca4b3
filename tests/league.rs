//! The league demo end to end through HTTP: a real server over
//! `dataset-demo/league` and `intents/league` answers table, score, fixture
//! and form questions, and a batch that finishes the live match changes the
//! computed table in the next answers.

mod common;

use std::path::PathBuf;
use std::sync::Arc;

use common::Server;
use serde_json::{json, Value};
use tidings::dialogue::MemoryStore;
use tidings::engine::{self, Clock, Engine, Settings, Sources};

const TOKEN: &str = "admin-token-for-league-tests-0123";
/// The league demo's own clock: matchday 13 under way.
const NOW: &str = "2027-11-06T16:05:00+00:00";

fn root() -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR"))
}

fn league_engine() -> Engine {
    let snap = engine::load(&Sources {
        data: Some(root().join("dataset-demo/league")),
        intents: Some(root().join("intents/league")),
    })
    .expect("the league demo loads");
    let mut settings =
        Settings::with_clock(Clock::Fixed(NOW.parse().unwrap()), b"test-secret".to_vec());
    settings.admin_token = Some(TOKEN.into());
    Engine::new(snap, Arc::new(MemoryStore::new()), settings)
}

/// Points as replies write them: words to nine, figures from 10.
fn pts(n: i64) -> String {
    tidings::answers::value::int_words(n, tidings::answers::value::Style::Text, false) + " points"
}

fn text(body: &Value) -> String {
    body["text"].as_str().unwrap_or_default().to_string()
}

/// Points per club from the contests file, counted here with 3 for a win
/// and 1 for a draw, independently of the engine.
fn points_from_file() -> std::collections::HashMap<String, i64> {
    let contests: Vec<Value> = serde_json::from_str(
        &std::fs::read_to_string(root().join("dataset-demo/league/contests.json")).unwrap(),
    )
    .unwrap();
    let mut points = std::collections::HashMap::new();
    for c in contests.iter().filter(|c| c["discipline"] == "league") {
        let e = c["entries"].as_array().unwrap();
        let club = |i: usize| e[i]["group"].as_str().unwrap().to_string();
        points.entry(club(0)).or_insert(0);
        points.entry(club(1)).or_insert(0);
        if c["status"] != "final" {
            continue;
        }
        let goals = |i: usize| e[i]["mark"].as_str().unwrap().parse::<u32>().unwrap();
        let (h, a) = (goals(0), goals(1));
        let (ph, pa) = match h.cmp(&a) {
            std::cmp::Ordering::Greater => (3, 0),
            std::cmp::Ordering::Less => (0, 3),
            std::cmp::Ordering::Equal => (1, 1),
        };
        *points.get_mut(&club(0)).unwrap() += ph;
        *points.get_mut(&club(1)).unwrap() += pa;
    }
    points
}

#[tokio::test]
async fn league_questions_are_answered_through_http() {
    let s = Server::start(league_engine()).await;
    let points = points_from_file();
    let best = points.values().max().copied().unwrap();

    let (status, body) = s.ask("reader-1", "who is top of the league?").await;
    assert_eq!(status, 200);
    assert_eq!(body["intent"], "table_leader");
    assert!(
        text(&body).contains(&format!("with {}", pts(best))),
        "{body}"
    );

    let (_, body) = s.ask("reader-2", "where are Rovers in the table?").await;
    assert_eq!(body["intent"], "club_position");
    let rovers = points["brackenholt"];
    assert!(text(&body).contains(&pts(rovers)), "{body}");

    // A follow-up keeps the club: its next match.
    let (_, body) = s.ask("reader-2", "when do they play next?").await;
    assert_eq!(body["intent"], "club_next");
    assert!(text(&body).starts_with("Brackenholt Rovers play"), "{body}");

    let (_, body) = s
        .ask("reader-3", "what's the score in the Hollinsby game?")
        .await;
    assert_eq!(body["intent"], "match_score");
    assert!(text(&body).contains("under way"), "{body}");

    let (_, body) = s.ask("reader-4", "score in Dunmerle v Iverlock").await;
    assert_eq!(body["outcome"], "no_data");
    assert!(text(&body).contains("postponed"), "{body}");

    let (_, body) = s.ask("reader-5", "what is Ambervale's form").await;
    assert_eq!(body["intent"], "club_form");
    let form = text(&body);
    assert_eq!(
        form.split(": ")
            .nth(1)
            .unwrap_or_default()
            .split(" (")
            .next()
            .unwrap()
            .split(' ')
            .count(),
        5,
        "five results: {form}"
    );
}

#[tokio::test]
async fn a_batch_that_finishes_the_live_match_changes_the_table() {
    let s = Server::start(league_engine()).await;
    let before = points_from_file();
    let (_, body) = s.ask("reader-1", "where are Fenwarrow in the table?").await;
    assert!(text(&body).contains(&pts(before["fenwarrow"])), "{body}");
    // The live match ends 2–1 to the home side, Fenwarrow Wanderers.
    let batch = json!({"as_of": "2027-11-06T16:55:00+00:00", "changes": [
        {"change": "results", "contest": "md13-fenwarrow-hollinsby", "status": "final", "entries": [
            {"group": "fenwarrow", "side": "home", "mark": "2"},
            {"group": "hollinsby", "side": "away", "mark": "1"}
        ]}
    ]});
    let r = s
        .client
        .post(s.url("/v1/admin/batches"))
        .bearer_auth(TOKEN)
        .json(&batch)
        .send()
        .await
        .unwrap();
    assert_eq!(r.status().as_u16(), 200, "{}", r.text().await.unwrap());
    let (_, body) = s.ask("reader-2", "where are Fenwarrow in the table?").await;
    assert!(
        text(&body).contains(&pts(before["fenwarrow"] + 3)),
        "{body}"
    );
    let (_, body) = s
        .ask("reader-3", "what's the score in the Hollinsby game?")
        .await;
    assert!(
        text(&body).contains("Fenwarrow Wanderers beat Hollinsby United"),
        "{body}"
    );
    // A batch that leaves a final match without a score is refused whole.
    let bad = json!({"changes": [
        {"change": "results", "contest": "md13-iverlock-elverstow", "status": "final", "entries": [
            {"group": "iverlock", "side": "home"},
            {"group": "elverstow", "side": "away", "mark": "1"}
        ]}
    ]});
    let r = s
        .client
        .post(s.url("/v1/admin/batches"))
        .bearer_auth(TOKEN)
        .json(&bad)
        .send()
        .await
        .unwrap();
    let status = r.status().as_u16();
    let body: Value = r.json().await.unwrap();
    assert_eq!(status, 422, "{body}");
    assert!(
        body.to_string().contains("needs each side's score"),
        "{body}"
    );
}
