//! Markup in the data's names never reaches a client live: a winner named
//! with a Markdown link, an HTML tag, emphasis, code and a bidirectional
//! control is asked about on every channel. `markdown` is checked with a
//! CommonMark parser (pulldown-cmark), `ssml` with an XML parser, and the
//! plain-text fields for what they must not hold.

mod common;

use std::path::PathBuf;
use std::sync::Arc;

use pulldown_cmark::{Event, Parser, Tag, TagEnd};
use tidings::dialogue::MemoryStore;
use tidings::engine::{self, Clock, Engine, Settings, Sources};

const GIVEN: &str = "[Wonorin](http://evil.test) *x* `y`";
const FAMILY: &str = "<img src=x onerror=alert(1)>Galkace &amp; \u{202E}co|~~";

/// The demo games with the men's 100 m winner renamed, in a folder of the
/// test's own.
fn hostile_engine() -> Engine {
    let root = PathBuf::from(env!("CARGO_MANIFEST_DIR"));
    let dir = std::env::temp_dir().join(format!("tidings-escaping-{:016x}", rand::random::<u64>()));
    std::fs::create_dir_all(&dir).unwrap();
    for f in [
        "competitors.json",
        "contests.json",
        "groups.json",
        "scenario.json",
        "sports.json",
    ] {
        std::fs::copy(root.join("dataset-demo/games").join(f), dir.join(f)).unwrap();
    }
    let path = dir.join("competitors.json");
    let mut people: serde_json::Value =
        serde_json::from_str(&std::fs::read_to_string(&path).unwrap()).unwrap();
    let winner = people
        .as_array_mut()
        .and_then(|a| a.iter_mut().find(|p| p["family"] == "Galkace"))
        .expect("the demo has its 100 m winner");
    winner["given"] = GIVEN.into();
    winner["family"] = FAMILY.into();
    std::fs::write(&path, serde_json::to_string(&people).unwrap()).unwrap();
    let snap = engine::load(&Sources {
        data: Some(dir.clone()),
        intents: None,
    })
    .expect("hostile names are still names");
    let _ = std::fs::remove_dir_all(&dir);
    let settings = Settings::with_clock(Clock::Fixed(common::NOW.parse().unwrap()), b"t".to_vec());
    Engine::new(snap, Arc::new(MemoryStore::new()), settings)
}

fn assert_plain(field: &str, text: &str) {
    assert!(
        !text
            .chars()
            .any(|c| c.is_control() || ('\u{202A}'..='\u{202E}').contains(&c)),
        "{field} holds control characters: {text:?}"
    );
    assert!(
        !text.contains('\u{E000}') && !text.contains('\u{E001}'),
        "{text:?}"
    );
}

#[tokio::test]
async fn hostile_names_are_escaped_for_each_output_format_on_every_channel() {
    let engine = hostile_engine();
    for channel in ["chat", "sms", "voice", "plain"] {
        let a = engine
            .handle(
                &format!("hostile-{channel}"),
                channel,
                "who won the men's 100 m?",
            )
            .await
            .unwrap();
        let r = &a.reply;
        assert_plain("text", &r.text);
        for q in &r.quick_replies {
            assert_plain("a quick reply", q);
            assert!(!q.contains('\\'), "quick replies are plain text: {q:?}");
        }
        if channel != "sms" && channel != "voice" {
            // Plain text: the name as it is, nothing escaped or dropped
            // but the bidirectional control.
            assert!(r.text.contains(GIVEN), "{channel}: {:?}", r.text);
            assert!(
                r.text
                    .contains("<img src=x onerror=alert(1)>Galkace &amp; co|~~"),
                "{:?}",
                r.text
            );
        }
        if let Some(md) = &r.markdown {
            let mut shown = String::new();
            for event in Parser::new(md) {
                match event {
                    Event::Text(t) => shown.push_str(&t),
                    Event::SoftBreak | Event::HardBreak => shown.push(' '),
                    Event::Start(Tag::Strong) | Event::End(TagEnd::Strong) => {}
                    Event::Start(Tag::Paragraph) | Event::End(TagEnd::Paragraph) => {}
                    other => panic!("{channel}: markdown makes {other:?} of {md:?}"),
                }
            }
            // What the client shows is the text itself.
            assert_eq!(shown, r.text, "{md}");
        }
        if let Some(ssml) = &r.ssml {
            let doc = roxmltree::Document::parse(ssml).expect("the SSML is well-formed XML");
            for node in doc.descendants().filter(|n| n.is_element()) {
                assert!(
                    ["speak", "s", "say-as", "break", "p"].contains(&node.tag_name().name()),
                    "unexpected element {:?} in {ssml}",
                    node.tag_name().name()
                );
            }
        }
    }
}

#[test]
fn commonmark_sees_escaped_text_as_text() {
    use tidings::answers::channel::markdown;
    // Block starts at the start of a line, and inline markup anywhere.
    for text in [
        "# heading",
        "1. first",
        "- item",
        "> quote",
        "a [b](c) <d> `e` *f* _g_ &amp; h\\",
        "2) x",
    ] {
        let md = markdown(text);
        let mut shown = String::new();
        for event in Parser::new(&md) {
            match event {
                Event::Text(t) => shown.push_str(&t),
                Event::Start(Tag::Paragraph) | Event::End(TagEnd::Paragraph) => {}
                other => panic!("{text:?} as {md:?} makes {other:?}"),
            }
        }
        assert_eq!(shown, text, "{md:?}");
    }
}
