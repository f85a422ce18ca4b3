//! The editors' desk: one page at `/desk` where an editor asks questions as
//! a reader would, on any channel, and sees the reply as that channel
//! shapes it (bubble, SMS segment, SSML) next to how the message was
//! understood (intent, slots, confidence, runner-up intents); a second view
//! lists the questions readers asked that got no answer.
//!
//! Why it is served by the service itself: editors tune intents while the
//! service runs (`serve --watch`), and a page that comes with the binary
//! needs nothing installed and always talks to the catalog in force. It is
//! plain HTML, CSS and JavaScript compiled in with `include_str!`, so there
//! is no build step and no third-party URL; the content security policy
//! allows this origin only.
//!
//! The page uses nothing but the public API (`POST /v1/messages`) and, for
//! the unanswered list, the admin API with a token the editor types in and
//! the page keeps in memory only. The one thing filled in here is the
//! channel selector, from the profiles in force: a channel added in an
//! intents folder's `channels.yaml` shows up without widening the API.

use axum::extract::State;
use axum::http::header::{self, HeaderName};
use axum::response::IntoResponse;

use super::openapi::{Api, Body, Guard, Op};

use crate::engine::Engine;

/// The page; [`CHANNELS_SLOT`] and [`SCENARIO_SLOT`] are filled in per request.
const PAGE: &str = include_str!("desk/desk.html");
const STYLE: &str = include_str!("desk/desk.css");
const SCRIPT: &str = include_str!("desk/desk.js");

/// Where the channel `<option>`s go in [`PAGE`].
const CHANNELS_SLOT: &str = "<!-- channel options -->";
/// Where the scenario's title goes in [`PAGE`].
const SCENARIO_SLOT: &str = "<!-- scenario title -->";

/// This origin only, and no inline script or style: the page's data are
/// readers' questions and replies, and none of them may ever run as code.
pub const POLICY: &str = "default-src 'none'; script-src 'self'; style-src 'self'; \
connect-src 'self'; img-src 'self'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'";

/// Headers every desk response carries. `no-cache`: the files are compiled
/// into the binary, so a browser must check again after an upgrade, and the
/// page carries the channels in force, which a reload may change.
fn headers(content_type: &'static str) -> [(HeaderName, &'static str); 5] {
    [
        (header::CONTENT_TYPE, content_type),
        (header::CACHE_CONTROL, "no-cache"),
        (header::CONTENT_SECURITY_POLICY, POLICY),
        (header::X_CONTENT_TYPE_OPTIONS, "nosniff"),
        (header::REFERRER_POLICY, "no-referrer"),
    ]
}

async fn page(State(engine): State<Engine>) -> impl IntoResponse {
    let snap = engine.snapshot();
    let channels = &snap.catalog.channels;
    let profiles: Vec<(&str, &str)> = channels
        .names()
        .into_iter()
        .map(|name| {
            let summary = channels.get(name).map_or("", |p| p.summary.as_str());
            (name, summary)
        })
        .collect();
    (
        headers("text/html; charset=utf-8"),
        render(&profiles, &snap.data.scenario.title),
    )
}

async fn style() -> impl IntoResponse {
    (headers("text/css; charset=utf-8"), STYLE)
}

async fn script() -> impl IntoResponse {
    (headers("text/javascript; charset=utf-8"), SCRIPT)
}

/// The page with the channel selector's options (name and summary of each
/// profile; `chat` chosen when there is one, else the first) and the
/// scenario's title, escaped.
fn render(profiles: &[(&str, &str)], title: &str) -> String {
    let default = if profiles.iter().any(|(n, _)| *n == "chat") {
        "chat"
    } else {
        profiles.first().map_or("", |(n, _)| *n)
    };
    let mut options = String::new();
    for (name, summary) in profiles {
        let selected = if *name == default { " selected" } else { "" };
        options.push_str(&format!(
            "<option value=\"{v}\" title=\"{s}\"{selected}>{v}</option>",
            v = escape(name),
            s = escape(summary),
        ));
    }
    PAGE.replacen(CHANNELS_SLOT, &options, 1)
        .replacen(SCENARIO_SLOT, &escape(title), 1)
}

/// Text made safe for HTML element content and quoted attribute values.
fn escape(text: &str) -> String {
    let mut out = String::with_capacity(text.len());
    for c in text.chars() {
        match c {
            '&' => out.push_str("&amp;"),
            '<' => out.push_str("&lt;"),
            '>' => out.push_str("&gt;"),
            '"' => out.push_str("&quot;"),
            '\'' => out.push_str("&#39;"),
            c => out.push(c),
        }
    }
    out
}

/// The desk's routes: the page and its two files.
pub fn routes() -> Api {
    let op =
        |summary, media, description| Op::new(summary, Guard::Desk, Body::Text(media, description));
    Api::new()
        .get(
            "/desk",
            page,
            op(
                "The editors' desk page",
                "text/html",
                "The page, with the channels in force.",
            ),
        )
        .get(
            "/desk/desk.css",
            style,
            op("The desk page's style", "text/css", "The style sheet."),
        )
        .get(
            "/desk/desk.js",
            script,
            op("The desk page's script", "text/javascript", "The script."),
        )
}

#[cfg(test)]
mod tests {
    use std::sync::Arc;

    use axum::body::Body;
    use axum::http::{Request, StatusCode};
    use axum::Router;
    use tower::ServiceExt;

    use super::*;
    use crate::dialogue::MemoryStore;
    use crate::engine::{self, Clock, Settings, Sources};

    fn demo_app() -> Router {
        let snap = engine::load(&Sources::default()).expect("the demo loads");
        let settings = Settings::with_clock(
            Clock::Fixed("2027-08-14T21:10:00+01:00".parse().unwrap()),
            b"test-secret".to_vec(),
        );
        crate::http::app(Engine::new(snap, Arc::new(MemoryStore::new()), settings))
    }

    async fn get_path(path: &str) -> (StatusCode, axum::http::HeaderMap, String) {
        let r = demo_app()
            .oneshot(Request::get(path).body(Body::empty()).unwrap())
            .await
            .unwrap();
        let status = r.status();
        let headers = r.headers().clone();
        let body = axum::body::to_bytes(r.into_body(), usize::MAX)
            .await
            .unwrap();
        (status, headers, String::from_utf8(body.to_vec()).unwrap())
    }

    #[test]
    fn the_page_has_each_slot_once_and_links_only_its_own_files() {
        assert_eq!(PAGE.matches(CHANNELS_SLOT).count(), 1);
        assert_eq!(PAGE.matches(SCENARIO_SLOT).count(), 1);
        assert!(PAGE.contains(r#"<link rel="stylesheet" href="/desk/desk.css">"#));
        assert!(PAGE.contains(r#"<script src="/desk/desk.js" defer></script>"#));
        // No inline script or style: the policy would block them.
        assert!(!PAGE.contains("<style") && !PAGE.contains(" style="));
        assert_eq!(PAGE.matches("<script").count(), 1);
        for file in [PAGE, STYLE, SCRIPT] {
            assert!(!file.contains("http://") && !file.contains("https://"));
        }
        // Data go in as text, never as markup.
        assert!(!SCRIPT.contains("innerHTML") && !SCRIPT.contains("insertAdjacentHTML"));
    }

    #[tokio::test]
    async fn the_page_lists_the_channels_in_force_with_chat_chosen() {
        let (status, headers, body) = get_path("/desk").await;
        assert_eq!(status, StatusCode::OK);
        assert_eq!(headers[header::CONTENT_TYPE], "text/html; charset=utf-8");
        assert_eq!(headers[header::CACHE_CONTROL], "no-cache");
        assert_eq!(headers[header::CONTENT_SECURITY_POLICY], POLICY);
        assert_eq!(headers[header::X_CONTENT_TYPE_OPTIONS], "nosniff");
        for name in ["plain", "sms", "voice"] {
            assert!(
                body.contains(&format!(r#"<option value="{name}" title=""#)),
                "{name} is missing from the selector"
            );
        }
        assert!(body.contains(
            r#"title="chat bubbles in an app or a messaging platform" selected>chat</option>"#
        ));
        assert_eq!(body.matches(" selected>").count(), 1);
        assert!(body.contains("The 2027 Lowenfirth Coast Games"));
        assert!(!body.contains(CHANNELS_SLOT) && !body.contains(SCENARIO_SLOT));
    }

    #[tokio::test]
    async fn the_style_and_script_come_with_their_content_types() {
        let (status, headers, body) = get_path("/desk/desk.css").await;
        assert_eq!(status, StatusCode::OK);
        assert_eq!(headers[header::CONTENT_TYPE], "text/css; charset=utf-8");
        assert_eq!(headers[header::CACHE_CONTROL], "no-cache");
        assert_eq!(body, STYLE);
        let (status, headers, body) = get_path("/desk/desk.js").await;
        assert_eq!(status, StatusCode::OK);
        assert_eq!(
            headers[header::CONTENT_TYPE],
            "text/javascript; charset=utf-8"
        );
        assert_eq!(body, SCRIPT);
        let (status, _, body) = get_path("/desk/nothing.js").await;
        assert_eq!(status, StatusCode::NOT_FOUND);
        assert!(body.contains("not_found"));
    }

    #[test]
    fn channel_names_summaries_and_title_are_escaped() {
        let page = render(
            &[("<b>\"x\"", "a & b's <i>"), ("plain", "text")],
            "<script>alert(1)</script>",
        );
        assert!(page.contains(
            r#"<option value="&lt;b&gt;&quot;x&quot;" title="a &amp; b&#39;s &lt;i&gt;" selected>&lt;b&gt;&quot;x&quot;</option>"#
        ));
        assert!(page.contains("&lt;script&gt;alert(1)&lt;/script&gt;"));
        assert!(!page.contains("<b>") && !page.contains("<script>alert"));
    }

    #[test]
    fn without_chat_the_first_channel_is_chosen() {
        let page = render(&[("plain", ""), ("voice", "")], "t");
        assert!(page.contains(r#"<option value="plain" title="" selected>plain</option>"#));
        assert!(page.contains(r#"<option value="voice" title="">voice</option>"#));
        // No channel at all still gives a page (with an empty selector).
        let page = render(&[], "t");
        assert!(!page.contains("<option") && !page.contains(CHANNELS_SLOT));
    }
}
