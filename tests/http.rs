//! The HTTP API against a real server on a loopback port.

mod common;

use common::{demo_engine, Server};
use serde_json::json;

#[tokio::test]
async fn a_question_gets_an_answer_with_its_version() {
    let s = Server::start(demo_engine()).await;
    let (status, body) = s.ask("reader-1", "Who won the men's 100m?").await;
    assert_eq!(status, 200);
    assert_eq!(body["outcome"], "answered");
    assert_eq!(body["intent"], "podium");
    assert_eq!(body["slots"]["contest"]["value"], "ath-m-100m-final");
    let text = body["text"].as_str().unwrap();
    assert!(
        text.starts_with("Wonorin Galkace (Quessary) won the men's 100 m final"),
        "{text}"
    );
    assert_eq!(body["dataset_version"], 1);
    assert_eq!(body["as_of"], "2027-08-14T21:04:00+01:00");
    assert!(body["confidence"].as_f64().unwrap() > 0.5);
    // What explains the reply only when asked for.
    assert!(body.get("candidates").is_none(), "{body}");
    assert!(body.get("facts").is_none(), "{body}");
}

/// A message with `"explain": true`.
async fn ask_explained(
    s: &Server,
    user: &str,
    text: &str,
    message_id: Option<&str>,
) -> (u16, serde_json::Value) {
    let mut body = json!({"user": user, "text": text, "explain": true});
    if let Some(id) = message_id {
        body["message_id"] = json!(id);
    }
    let r = s
        .client
        .post(s.url("/v1/messages"))
        .json(&body)
        .send()
        .await
        .unwrap();
    (r.status().as_u16(), r.json().await.unwrap())
}

#[tokio::test]
async fn asked_to_explain_a_reply_carries_its_candidates_and_facts() {
    let s = Server::start(demo_engine()).await;
    let (status, body) = ask_explained(&s, "reader-1", "Who won the men's 100m?", None).await;
    assert_eq!(status, 200);
    assert_eq!(body["intent"], "podium");
    assert_eq!(body["candidates"][0]["intent"], "podium");
    assert!(body["candidates"][0]["shared"]
        .as_array()
        .unwrap()
        .iter()
        .any(|w| w == "won"));
    assert_eq!(
        body["facts"]["gold"][0]["text"], "Wonorin Galkace (Quessary)",
        "{body}"
    );
    // `false` is the default, said out loud.
    let r = s
        .client
        .post(s.url("/v1/messages"))
        .json(&json!({"user": "reader-1b", "text": "medal table", "explain": false}))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 200);
    let body: serde_json::Value = r.json().await.unwrap();
    assert!(body.get("candidates").is_none() && body.get("facts").is_none());
    // Not a boolean: the reader's client is told, no 500.
    let r = s
        .client
        .post(s.url("/v1/messages"))
        .json(&json!({"user": "reader-1c", "text": "medal table", "explain": "yes"}))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 422);
}

#[tokio::test]
async fn a_retry_may_ask_for_the_explanation_of_the_first_reply() {
    let s = Server::start(demo_engine()).await;
    let (_, first, repeated) =
        common::post_message(&s, "reader-r", "who won the men's 100 m?", Some("m-1")).await;
    assert!(!repeated);
    assert!(first.get("candidates").is_none());
    let (_, again) = ask_explained(&s, "reader-r", "who won the men's 100 m?", Some("m-1")).await;
    assert_eq!(again["text"], first["text"]);
    assert_eq!(again["candidates"][0]["intent"], "podium", "{again}");
    assert!(again["facts"]["gold"].is_array(), "{again}");
}

#[tokio::test]
async fn healthz_reports_the_loaded_scenario() {
    let s = Server::start(demo_engine()).await;
    let r = s.client.get(s.url("/healthz")).send().await.unwrap();
    assert_eq!(r.status(), 200);
    let body: serde_json::Value = r.json().await.unwrap();
    assert_eq!(body["status"], "ok");
    assert!(body["intents"].as_u64().unwrap() >= 14);
}

#[tokio::test]
async fn an_ambiguous_name_is_asked_about_and_the_answer_is_used() {
    let s = Server::start(demo_engine()).await;
    let (_, first) = s.ask("reader-2", "how did Zoe do?").await;
    assert_eq!(first["outcome"], "clarify");
    let text = first["text"].as_str().unwrap();
    for name in ["Zoë Quillon", "Zoë Marrant", "Zoë Tassevar"] {
        assert!(text.contains(name), "{text}");
    }
    assert_eq!(first["options"].as_array().unwrap().len(), 3);
    let (_, second) = s.ask("reader-2", "the rower").await;
    assert_eq!(second["slots"]["competitor"]["value"], "p199", "{second}");
    assert!(second["text"].as_str().unwrap().contains("Zoë Marrant"));
    // Another reader's conversation is separate.
    let (_, other) = s.ask("reader-3", "the rower").await;
    assert_ne!(other["slots"]["competitor"]["value"], "p199");
}

#[tokio::test]
async fn a_missing_detail_is_asked_for_then_filled() {
    let s = Server::start(demo_engine()).await;
    let (_, first) = s.ask("reader-4", "who won?").await;
    assert_eq!(first["outcome"], "clarify");
    assert_eq!(first["text"], "Which event do you mean?");
    let (_, second) = s.ask("reader-4", "the women's long jump").await;
    assert_eq!(second["outcome"], "answered", "{second}");
    assert_eq!(second["intent"], "podium");
    assert_eq!(second["slots"]["contest"]["value"], "ath-w-long-jump-final");
}

#[tokio::test]
async fn malformed_json_is_a_400_in_the_service_format() {
    let s = Server::start(demo_engine()).await;
    let r = s
        .client
        .post(s.url("/v1/messages"))
        .header("content-type", "application/json")
        .body("{\"user\": \"a\", \"text\": ")
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 400);
    let body: serde_json::Value = r.json().await.unwrap();
    assert_eq!(body["error"]["code"], "malformed_json");
    assert!(!body["error"]["message"].as_str().unwrap().is_empty());
}

#[tokio::test]
async fn an_oversize_body_is_a_413() {
    let s = Server::start(demo_engine()).await;
    let big = "x".repeat(17 * 1024);
    let r = s
        .client
        .post(s.url("/v1/messages"))
        .json(&json!({"user": "a", "text": big}))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 413);
    let body: serde_json::Value = r.json().await.unwrap();
    assert_eq!(body["error"]["code"], "body_too_large");
}

#[tokio::test]
async fn empty_or_over_long_text_is_a_422() {
    let s = Server::start(demo_engine()).await;
    for (text, code) in [
        ("   ", "empty_text"),
        (&"a".repeat(501)[..], "text_too_long"),
    ] {
        let r = s
            .client
            .post(s.url("/v1/messages"))
            .json(&json!({"user": "a", "text": text}))
            .send()
            .await
            .unwrap();
        assert_eq!(r.status(), 422);
        let body: serde_json::Value = r.json().await.unwrap();
        assert_eq!(body["error"]["code"], code);
    }
}

#[tokio::test]
async fn wrong_shapes_and_channels_are_422_never_500() {
    let s = Server::start(demo_engine()).await;
    let cases = [
        json!({"user": "a"}),
        json!({"user": "a", "text": 5}),
        json!({"user": "", "text": "hello"}),
        json!({"user": "a", "text": "hello", "channel": "pigeon"}),
        json!({"user": "a", "text": "hello", "extra": true}),
    ];
    for c in cases {
        let r = s
            .client
            .post(s.url("/v1/messages"))
            .json(&c)
            .send()
            .await
            .unwrap();
        assert_eq!(r.status(), 422, "{c}");
        let body: serde_json::Value = r.json().await.unwrap();
        assert!(body["error"]["message"].is_string(), "{c}");
    }
    let r = s
        .client
        .post(s.url("/v1/messages"))
        .body("user=a")
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 415);
    let r = s.client.get(s.url("/v2/nothing")).send().await.unwrap();
    assert_eq!(r.status(), 404);
}

#[tokio::test]
async fn odd_reader_text_never_breaks_the_service() {
    let s = Server::start(demo_engine()).await;
    let odd = [
        "?",
        "🙂🙂🙂",
        "<break time=\"9s\"/> & Co",
        "\u{0}\u{1}\u{2}",
        "who won the the the the",
        "ＷＨＯ　ＷＯＮ　ＴＨＥ　ＭＥＮ'Ｓ　１００Ｍ",
        "1:59.32 10.12 9,999,999,999,999,999,999",
        "ł ø đ ß æ",
    ];
    for text in odd {
        let (status, body) = s.ask("odd", text).await;
        assert_eq!(status, 200, "{text}");
        assert!(!body["text"].as_str().unwrap().is_empty(), "{text}");
    }
}

#[tokio::test]
async fn a_wrong_method_and_a_bad_path_get_the_json_error_format() {
    let s = Server::start(demo_engine()).await;
    let r = s.client.get(s.url("/v1/messages")).send().await.unwrap();
    assert_eq!(r.status(), 405);
    assert_eq!(r.headers()["allow"], "POST");
    let body: serde_json::Value = r.json().await.unwrap();
    assert_eq!(body["error"]["code"], "method_not_allowed");
    // %FF decodes to a byte that is not UTF-8.
    let r = s
        .client
        .delete(s.url("/v1/users/chat/%FF"))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 400);
    let body: serde_json::Value = r.json().await.unwrap();
    assert_eq!(body["error"]["code"], "bad_path");
    // A message id of the wrong length is a 422, not a 500.
    let r = s
        .client
        .post(s.url("/v1/messages"))
        .json(&json!({"user": "r", "text": "hi", "message_id": ""}))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 422);
    let body: serde_json::Value = r.json().await.unwrap();
    assert_eq!(body["error"]["code"], "bad_message_id");
}

#[tokio::test]
async fn every_channel_is_served_over_http_with_its_own_shape() {
    let s = Server::start(demo_engine()).await;
    let ask = |channel: &'static str| {
        let s = &s;
        async move {
            let r = s
                .client
                .post(s.url("/v1/messages"))
                .json(&json!({"user": format!("r-{channel}"), "text": "who won the women's 100 m freestyle?", "channel": channel}))
                .send()
                .await
                .unwrap();
            assert_eq!(r.status(), 200, "{channel}");
            r.json::<serde_json::Value>().await.unwrap()
        }
    };
    let chat = ask("chat").await;
    assert_eq!(chat["channel"], "chat");
    assert!(chat["quick_replies"]
        .as_array()
        .is_some_and(|q| !q.is_empty()));
    assert!(chat["markdown"]
        .as_str()
        .unwrap()
        .contains("**Pevelle Cosevmont (Vastrelia)**"));
    assert!(chat.get("ssml").is_none());

    let sms = ask("sms").await;
    assert_eq!(sms["sms"]["limit"], 160);
    assert!(sms["sms"]["units"].as_u64().unwrap() <= 160);
    assert!(sms.get("quick_replies").is_none());

    let voice = ask("voice").await;
    let doc = voice["ssml"].as_str().unwrap();
    assert!(doc.contains("<speak version=\"1.1\""), "{doc}");
    assert!(voice["text"]
        .as_str()
        .unwrap()
        .contains("one hundred metres"));

    let plain = ask("plain").await;
    assert!(plain.get("ssml").is_none() && plain.get("markdown").is_none());
    assert!(plain["text"].as_str().unwrap().contains("100 m"));
}
