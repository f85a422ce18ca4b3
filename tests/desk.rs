//! The desk page in a real browser: headless Chromium, driven through
//! chromedriver (WebDriver), asks questions on the page as an editor would
//! and the test checks what the page shows against what the API answers for
//! the same question; it switches to the voice channel and finds the SSML,
//! lists the unanswered questions with the admin token, and takes
//! screenshots that must decode and show more than a blank page.
//!
//! Chromium and chromedriver come from Debian's `chromium` and
//! `chromium-driver` packages, which `tests/run.sh` installs when they are
//! missing. Without them this test fails and says so; it never skips.
//! `TIDINGS_CHROMIUM` and `TIDINGS_CHROMEDRIVER` point it at other copies.
//! Screenshots are kept in `target/desk-test/`.

mod common;

use std::io::{BufRead, BufReader, Read, Write};
use std::net::{SocketAddr, TcpStream};
use std::path::{Path, PathBuf};
use std::process::{Child, Command, Stdio};
use std::time::{Duration, Instant};

use common::ServeProcess;
use fantoccini::key::Key;
use fantoccini::{Client, ClientBuilder, Locator};
use hyper_util::client::legacy::connect::HttpConnector;
use serde_json::{json, Value};

const TOKEN: &str = "desk-admin-token-for-tests-0123";
const WIDTH: u32 = 1280;
const HEIGHT: u32 = 900;
/// How long any one thing may take to show up: CI machines are slow, and a
/// cold Chromium on two busy cores takes seconds to do anything.
const PATIENCE: Duration = Duration::from_secs(20);
/// The whole scenario, so a wedged browser fails the test instead of
/// hanging the run.
const SCENARIO_LIMIT: Duration = Duration::from_secs(300);

/// The path of a tool: the environment variable when set, else Debian's
/// place for it. A missing tool fails the test with what to install.
fn tool(var: &str, default: &str) -> String {
    let path = std::env::var(var).unwrap_or_else(|_| default.to_string());
    assert!(
        Path::new(&path).exists(),
        "{path} is missing: the desk browser test needs Debian's `chromium` and \
         `chromium-driver` packages (`apt-get install chromium chromium-driver`; \
         `bash tests/run.sh` installs them when missing), or set {var} to another copy"
    );
    path
}

/// A chromedriver of the test's own, on a port the kernel picks; shut down
/// with its browsers when dropped, even when the test fails.
struct Chromedriver {
    child: Child,
    addr: Option<SocketAddr>,
    url: String,
}

impl Chromedriver {
    fn start() -> Chromedriver {
        let bin = tool("TIDINGS_CHROMEDRIVER", "/usr/bin/chromedriver");
        let mut child = Command::new(&bin)
            .arg("--port=0")
            .stdout(Stdio::piped())
            .stderr(Stdio::null())
            .spawn()
            .unwrap_or_else(|e| panic!("{bin} does not start: {e}"));
        // chromedriver prints the port it bound; keep draining its output
        // afterwards so a full pipe never blocks it.
        let stdout = child.stdout.take().expect("stdout is piped");
        let (tx, rx) = std::sync::mpsc::channel::<u16>();
        std::thread::spawn(move || {
            for line in BufReader::new(stdout).lines().map_while(Result::ok) {
                if let Some(port) = line
                    .split("started successfully on port ")
                    .nth(1)
                    .and_then(|rest| rest.trim_end_matches('.').trim().parse().ok())
                {
                    let _ = tx.send(port);
                }
            }
        });
        // The guard exists before the wait, so a chromedriver that never
        // reports its port is still stopped.
        let mut driver = Chromedriver {
            child,
            addr: None,
            url: String::new(),
        };
        let port = rx
            .recv_timeout(PATIENCE)
            .unwrap_or_else(|_| panic!("{bin} did not report its port within {PATIENCE:?}"));
        driver.addr = Some(SocketAddr::from(([127, 0, 0, 1], port)));
        driver.url = format!("http://127.0.0.1:{port}");
        driver
    }

    /// Waits until chromedriver says it is ready for a session.
    async fn ready(&self) {
        let http = &reqwest::Client::new();
        let status = &format!("{}/status", self.url);
        common::wait_until("chromedriver to be ready", PATIENCE, move || async move {
            match http.get(status).send().await {
                Ok(r) => r
                    .json::<Value>()
                    .await
                    .is_ok_and(|v| v["value"]["ready"] == true),
                Err(_) => false,
            }
        })
        .await;
    }
}

impl Drop for Chromedriver {
    fn drop(&mut self) {
        // A killed chromedriver leaves its Chromium running; asked to shut
        // down, it quits its browsers first and then exits.
        if let Some(addr) = self.addr {
            let _ = shutdown(addr);
        }
        let deadline = Instant::now() + Duration::from_secs(10);
        while Instant::now() < deadline {
            if let Ok(Some(_)) = self.child.try_wait() {
                return;
            }
            std::thread::sleep(Duration::from_millis(50));
        }
        let _ = self.child.kill();
        let _ = self.child.wait();
    }
}

/// chromedriver's `GET /shutdown`, by hand: `Drop` cannot wait on the
/// async client.
fn shutdown(addr: SocketAddr) -> std::io::Result<()> {
    let mut s = TcpStream::connect_timeout(&addr, Duration::from_secs(2))?;
    s.set_read_timeout(Some(Duration::from_secs(5)))?;
    s.set_write_timeout(Some(Duration::from_secs(2)))?;
    s.write_all(b"GET /shutdown HTTP/1.1\r\nHost: 127.0.0.1\r\nConnection: close\r\n\r\n")?;
    let mut answer = Vec::new();
    s.read_to_end(&mut answer)?;
    Ok(())
}

/// A WebDriver session in headless Chromium at 1280x900.
async fn browser(driver: &Chromedriver, chromium: &str) -> Client {
    let mut caps = serde_json::Map::new();
    caps.insert(
        "goog:chromeOptions".into(),
        json!({
            "binary": chromium,
            "args": [
                "--headless=new",
                "--no-sandbox",
                "--disable-gpu",
                "--disable-dev-shm-usage",
                format!("--window-size={WIDTH},{HEIGHT}"),
            ],
        }),
    );
    // chromedriver listens on loopback over plain HTTP: no TLS connector.
    ClientBuilder::new(HttpConnector::new())
        .capabilities(caps)
        .connect(&driver.url)
        .await
        .unwrap_or_else(|e| {
            panic!(
                "no browser session from chromedriver at {}: {e}",
                driver.url
            )
        })
}

#[tokio::test(flavor = "multi_thread", worker_threads = 2)]
async fn an_editor_asks_on_the_desk_page_and_reads_the_unanswered_list() {
    let chromium = tool("TIDINGS_CHROMIUM", "/usr/bin/chromium");
    let driver = Chromedriver::start();
    let bin = env!("CARGO_BIN_EXE_tidings");
    let server = ServeProcess::start(bin, &[], &[("TIDINGS_ADMIN_TOKEN", TOKEN)]);
    // A second server with the admin API off, for the page's message.
    let closed = ServeProcess::start(bin, &[], &[]);
    driver.ready().await;
    let client = browser(&driver, &chromium).await;

    // The scenario runs as a task of its own so that, pass or fail, the
    // browser session is closed and chromedriver and both servers stopped
    // before the failure is reported.
    let task = tokio::spawn(scenario(
        client.clone(),
        server.base.clone(),
        closed.base.clone(),
    ));
    let abort = task.abort_handle();
    let outcome = tokio::time::timeout(SCENARIO_LIMIT, task).await;
    abort.abort();
    let _ = tokio::time::timeout(PATIENCE, client.close()).await;
    drop(driver);
    drop(server);
    drop(closed);
    match outcome {
        Err(_) => panic!("the desk scenario took longer than {SCENARIO_LIMIT:?}"),
        Ok(Err(e)) if e.is_panic() => std::panic::resume_unwind(e.into_panic()),
        Ok(Err(e)) => panic!("the desk scenario did not finish: {e}"),
        Ok(Ok(())) => {}
    }
}

async fn scenario(c: Client, base: String, closed_base: String) {
    let http = reqwest::Client::new();
    // With an admin token configured the desk is behind HTTP Basic; the
    // browser keeps the credentials for the page's own files and requests.
    let signed_in = base.replacen("http://", &format!("http://editor:{TOKEN}@"), 1);
    c.goto(&format!("{signed_in}/desk")).await.unwrap();
    wait_js(
        &c,
        "the page's script to set a reader id",
        "return document.getElementById('reader-id').textContent.startsWith('desk-')",
    )
    .await;
    // The style sheet applied (the policy lets this origin's files in).
    let ground = js(&c, "return getComputedStyle(document.body).backgroundColor").await;
    assert_eq!(ground, "rgb(242, 244, 247)");

    // The selector offers the channels the service has loaded, chat first
    // chosen, and the page says that channels have conversations of their own.
    let status = common::admin_status(&http, &base, TOKEN).await;
    let offered = js(
        &c,
        "return Array.from(document.querySelectorAll('#channel option'), o => o.value)",
    )
    .await;
    assert_eq!(offered, status["channels"]);
    assert!(offered.as_array().unwrap().len() >= 4, "{offered}");
    assert_eq!(
        js(&c, "return document.getElementById('channel').value").await,
        "chat"
    );
    let hint = text_of(&c, "channel-hint").await;
    assert!(
        hint.contains("switching channel starts a fresh conversation"),
        "{hint}"
    );

    // A question on chat: the reply as the API gives it, bold names as
    // <strong>, and how it was understood.
    let question = "Who won the women's long jump?";
    let api = ask_api(&http, &base, "chat", question).await;
    let turn = ask(&c, question).await;
    assert_eq!(turn["state"], "done", "{turn}");
    assert_eq!(turn["channel"], "chat");
    assert_eq!(turn["question"], question);
    assert_eq!(
        turn["reply"], api["text"],
        "the bubble reads as the API's text"
    );
    assert_eq!(turn["raw_text"], api["text"]);
    assert_eq!(turn["raw_markdown"], api["markdown"]);
    assert!(api["markdown"].as_str().unwrap().contains("**"), "{api}");
    assert!(turn["strong"].as_u64().unwrap() >= 3, "bold names: {turn}");
    assert!(
        turn["bold_marks_left"] == false,
        "no ** left on the page: {turn}"
    );
    assert_eq!(text_of(&c, "u-intent").await, "podium");
    assert_eq!(api["intent"], "podium");
    let confidence = text_of(&c, "u-confidence").await;
    assert_eq!(
        confidence,
        format!("{:.2}", api["confidence"].as_f64().unwrap())
    );
    assert!(text_of(&c, "u-outcome").await.starts_with("answered"));
    let data = text_of(&c, "u-data").await;
    assert!(
        data.contains("version 1") && data.contains("2027-08-14T21:04:00+01:00"),
        "{data}"
    );
    let slots = table_rows(&c, "u-slots").await;
    assert_eq!(
        slots,
        json!([[
            "contest",
            "contest",
            "ath-w-long-jump-final",
            "women's long jump"
        ]])
    );
    let runners = table_rows(&c, "u-runners-up").await;
    let api_runners: Vec<&Value> = api["candidates"]
        .as_array()
        .unwrap()
        .iter()
        .filter(|c| c["intent"] != api["intent"])
        .collect();
    assert!(!api_runners.is_empty(), "{api}");
    assert_eq!(
        runners.as_array().unwrap().len(),
        api_runners.len(),
        "{runners}"
    );
    assert_eq!(runners[0][0], api_runners[0]["intent"]);
    assert_eq!(
        runners[0][1],
        format!("{:.2}", api_runners[0]["score"].as_f64().unwrap())
    );
    assert_eq!(runners[0][2], api_runners[0]["example"]);
    // Quick replies, as the chat channel offers them, are buttons.
    assert!(
        !api["quick_replies"].as_array().unwrap().is_empty(),
        "{api}"
    );
    assert_eq!(turn["quick"], api["quick_replies"]);
    screenshot(&c, "chat").await;

    // A quick reply sends itself.
    let quick = api["quick_replies"][0].as_str().unwrap().to_string();
    let before = turns(&c).await;
    click(
        &c,
        Locator::Css("#thread .turn:last-of-type .quick-replies button"),
    )
    .await;
    let turn = settled_turn(&c, before).await;
    assert_eq!(turn["state"], "done", "{turn}");
    assert_eq!(turn["question"], quick);

    // On voice: spoken words and the SSML document, shown as text.
    choose_channel(&c, "voice").await;
    wait_js(
        &c,
        "the note that voice is a conversation of its own",
        "return Array.from(document.querySelectorAll('.channel-switch'), p => p.textContent).some(t => t.includes('voice'))",
    )
    .await;
    let api = ask_api(&http, &base, "voice", question).await;
    let turn = ask(&c, question).await;
    assert_eq!(turn["state"], "done", "{turn}");
    assert_eq!(turn["channel"], "voice");
    assert_eq!(turn["reply"], api["text"]);
    let ssml = turn["ssml"].as_str().expect("an SSML block on voice");
    assert!(
        ssml.contains("<speak") && ssml.contains(r#"version="1.1""#),
        "{ssml}"
    );
    assert_eq!(turn["ssml"], api["ssml"]);
    assert_eq!(
        js(&c, "return document.getElementsByTagName('speak').length").await,
        0,
        "the SSML is shown as text, never parsed as markup"
    );
    assert_eq!(turn["quick"], json!([]), "voice offers no buttons");
    screenshot(&c, "voice").await;

    // On SMS: a clarifying question with its segment fit, and its options
    // as buttons; choosing one answers it.
    choose_channel(&c, "sms").await;
    let unclear = "where is Zoe from?";
    let api = ask_api(&http, &base, "sms", unclear).await;
    assert_eq!(api["outcome"], "clarify", "{api}");
    let turn = ask(&c, unclear).await;
    assert_eq!(turn["state"], "done", "{turn}");
    assert_eq!(turn["channel"], "sms");
    assert_eq!(turn["reply"], api["text"]);
    let fit = turn["sms"].as_str().expect("the SMS fit is shown");
    let units = format!("{} of {} units", api["sms"]["units"], api["sms"]["limit"]);
    assert!(
        fit.contains(api["sms"]["encoding"].as_str().unwrap()) && fit.contains(&units),
        "{fit}"
    );
    let offered: Vec<Value> = api["options"]
        .as_array()
        .unwrap()
        .iter()
        .map(|o| o["text"].clone())
        .collect();
    assert!(offered.len() >= 2, "{api}");
    assert_eq!(turn["options"], Value::Array(offered.clone()));
    assert!(text_of(&c, "u-outcome").await.starts_with("clarify"));
    let before = turns(&c).await;
    click(
        &c,
        Locator::Css("#thread .turn:last-of-type .options button:nth-child(2)"),
    )
    .await;
    let turn = settled_turn(&c, before).await;
    assert_eq!(turn["state"], "done", "{turn}");
    assert_eq!(turn["question"], offered[1]);
    assert!(
        text_of(&c, "u-outcome").await.starts_with("answered"),
        "{turn}"
    );

    // An error from the API is shown, not swallowed.
    let too_long = "x".repeat(501);
    let turn = ask(&c, &too_long).await;
    assert_eq!(turn["state"], "error", "{turn}");
    let shown = text_of(&c, "ask-error").await;
    assert!(
        shown.contains("text must be at most 500 characters") && shown.contains("422"),
        "{shown}"
    );
    assert_eq!(
        js(&c, "return document.getElementById('ask-error').hidden").await,
        false
    );

    // Something no intent fits.
    let nonsense = "blorp fizzle wumble";
    let turn = ask(&c, nonsense).await;
    assert_eq!(turn["state"], "done", "{turn}");
    assert_eq!(text_of(&c, "u-intent").await, "not understood");
    assert!(text_of(&c, "u-outcome").await.starts_with("not_understood"));
    assert_eq!(
        js(&c, "return document.getElementById('ask-error').hidden").await,
        true,
        "a good reply clears the earlier error"
    );

    // A new conversation: a new reader id and an empty page.
    let reader = text_of(&c, "reader-id").await;
    click(&c, Locator::Id("new-conversation")).await;
    let fresh = text_of(&c, "reader-id").await;
    assert!(
        fresh.starts_with("desk-") && fresh != reader,
        "{reader} then {fresh}"
    );
    assert_eq!(turns(&c).await, 0);
    assert_eq!(
        js(&c, "return document.getElementById('understanding').hidden").await,
        true
    );

    // The unanswered list: a wrong token is refused, the right one lists
    // the nonsense (noted in the background, so it may take a moment).
    click(&c, Locator::Id("tab-unanswered")).await;
    wait_js(
        &c,
        "the unanswered view",
        "return !document.getElementById('view-unanswered').hidden && document.getElementById('view-ask').hidden",
    )
    .await;
    let token = c.find(Locator::Id("admin-token")).await.unwrap();
    token.send_keys("not-the-token").await.unwrap();
    click(&c, Locator::Id("unanswered-load")).await;
    let refused = wait_js(
        &c,
        "the wrong token's error",
        "const e = document.getElementById('unanswered-error'); return e.hidden ? null : e.textContent",
    )
    .await;
    assert!(
        refused
            .as_str()
            .unwrap()
            .contains("refused this admin token"),
        "{refused}"
    );
    assert_eq!(
        js(
            &c,
            "return document.getElementById('unanswered-table').hidden"
        )
        .await,
        true
    );
    token.clear().await.unwrap();
    token.send_keys(TOKEN).await.unwrap();
    let deadline = Instant::now() + PATIENCE;
    let rows = loop {
        click(&c, Locator::Id("unanswered-load")).await;
        wait_js(
            &c,
            "the list to load",
            "return !document.getElementById('unanswered-load').disabled",
        )
        .await;
        let rows = table_rows(&c, "unanswered-table").await;
        if rows.as_array().unwrap().iter().any(|r| r[0] == nonsense) {
            break rows;
        }
        assert!(
            Instant::now() < deadline,
            "{nonsense:?} never appeared in the unanswered list: {rows}; error: {}",
            text_of(&c, "unanswered-error").await
        );
        tokio::time::sleep(Duration::from_millis(200)).await;
    };
    let row = rows
        .as_array()
        .unwrap()
        .iter()
        .find(|r| r[0] == nonsense)
        .unwrap();
    assert_eq!(row[1], "not understood");
    assert_eq!(row[2], "1");
    assert_eq!(
        js(
            &c,
            "return document.getElementById('unanswered-error').hidden"
        )
        .await,
        true
    );
    screenshot(&c, "unanswered").await;

    // A server without an admin token: the page says the admin API is off.
    c.goto(&format!("{closed_base}/desk")).await.unwrap();
    click(&c, Locator::Id("tab-unanswered")).await;
    click(&c, Locator::Id("unanswered-load")).await;
    let off = wait_js(
        &c,
        "the admin-off message",
        "const e = document.getElementById('unanswered-error'); return e.hidden ? null : e.textContent",
    )
    .await;
    assert!(
        off.as_str()
            .unwrap()
            .contains("admin API is off on this server"),
        "{off}"
    );
}

/// Runs a script in the page and returns its value.
/// Clicks the element `at` points to.
async fn click(c: &Client, at: Locator<'_>) {
    c.find(at).await.unwrap().click().await.unwrap();
}

/// Picks a channel in the page's selector.
async fn choose_channel(c: &Client, channel: &str) {
    c.find(Locator::Id("channel"))
        .await
        .unwrap()
        .select_by_value(channel)
        .await
        .unwrap();
}

async fn js(c: &Client, script: &str) -> Value {
    c.execute(script, vec![])
        .await
        .unwrap_or_else(|e| panic!("the page did not run {script:?}: {e}"))
}

/// Polls a script until it returns something other than null or false,
/// and returns that.
async fn wait_js(c: &Client, what: &str, script: &str) -> Value {
    let deadline = Instant::now() + PATIENCE;
    loop {
        let v = js(c, script).await;
        if !(v.is_null() || v == false) {
            return v;
        }
        if Instant::now() > deadline {
            let page = js(c, "return document.body.innerText").await;
            panic!("timed out after {PATIENCE:?} waiting for {what}; the page reads:\n{page}");
        }
        tokio::time::sleep(Duration::from_millis(100)).await;
    }
}

async fn text_of(c: &Client, id: &str) -> String {
    js(
        c,
        &format!("return document.getElementById('{id}').textContent"),
    )
    .await
    .as_str()
    .unwrap_or_default()
    .to_string()
}

/// A table's body as rows of cell texts.
async fn table_rows(c: &Client, id: &str) -> Value {
    js(
        c,
        &format!(
            "return Array.from(document.getElementById('{id}').tBodies[0].rows, \
             r => Array.from(r.cells, td => td.textContent))"
        ),
    )
    .await
}

async fn turns(c: &Client) -> u64 {
    js(
        c,
        "return document.querySelectorAll('#thread .turn').length",
    )
    .await
    .as_u64()
    .unwrap()
}

/// Types a question into the page and presses Enter; the turn once the
/// reply (or an error) is in.
async fn ask(c: &Client, question: &str) -> Value {
    let before = turns(c).await;
    let input = c.find(Locator::Id("question")).await.unwrap();
    input.send_keys(question).await.unwrap();
    input
        .send_keys(&char::from(Key::Enter).to_string())
        .await
        .unwrap();
    settled_turn(c, before).await
}

/// Waits for a turn after the first `before` ones to be settled and
/// returns what the page shows for it.
async fn settled_turn(c: &Client, before: u64) -> Value {
    wait_js(
        c,
        "the reply to appear",
        &format!(
            "const all = document.querySelectorAll('#thread .turn');\n\
             if (all.length <= {before}) return null;\n\
             const t = all[all.length - 1];\n\
             if (t.dataset.state === 'pending') return null;\n\
             const text = (sel) => {{ const e = t.querySelector(sel); return e ? e.textContent : null; }};\n\
             return {{\n\
               state: t.dataset.state,\n\
               channel: t.dataset.channel,\n\
               question: text('.question'),\n\
               reply: text('.reply-text'),\n\
               raw_text: text('.raw-text'),\n\
               raw_markdown: text('.raw-markdown'),\n\
               strong: t.querySelectorAll('.reply-text strong').length,\n\
               bold_marks_left: (text('.reply-text') || '').includes('**'),\n\
               ssml: text('.ssml'),\n\
               quick: Array.from(t.querySelectorAll('.quick-replies button'), b => b.textContent),\n\
               options: Array.from(t.querySelectorAll('.options button'), b => b.textContent),\n\
               sms: text('.sms-info'),\n\
               error: t.dataset.state === 'error' ? text('.reply') : null,\n\
             }};"
        ),
    )
    .await
}

/// Asks the API directly, as a reader of its own on `channel`.
async fn ask_api(http: &reqwest::Client, base: &str, channel: &str, text: &str) -> Value {
    // With the explanation, as the page asks for it.
    let r = http
        .post(format!("{base}/v1/messages"))
        .json(&json!({
            "user": format!("desk-test-api-{channel}"),
            "text": text,
            "channel": channel,
            "explain": true,
        }))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 200, "{text:?} on {channel}");
    r.json().await.unwrap()
}

/// Saves a screenshot under `target/desk-test/` and checks that it renders:
/// a PNG of the window's size with the page on it, not one flat colour.
async fn screenshot(c: &Client, name: &str) {
    let viewport = js(c, "return [innerWidth, innerHeight, devicePixelRatio]").await;
    let px =
        |i: usize| (viewport[i].as_f64().unwrap() * viewport[2].as_f64().unwrap()).round() as u32;
    let (view_w, view_h) = (px(0), px(1));
    let png_bytes = c.screenshot().await.unwrap();
    // CARGO_TARGET_TMPDIR is `<target>/tmp`; the screenshots sit beside it.
    let dir = PathBuf::from(env!("CARGO_TARGET_TMPDIR"))
        .parent()
        .expect("the tmp dir is inside the target dir")
        .join("desk-test");
    std::fs::create_dir_all(&dir).unwrap();
    let path = dir.join(format!("{name}.png"));
    std::fs::write(&path, &png_bytes).unwrap();

    let mut decoder = png::Decoder::new(std::io::Cursor::new(&png_bytes));
    decoder.set_transformations(png::Transformations::normalize_to_color8());
    let mut reader = decoder
        .read_info()
        .unwrap_or_else(|e| panic!("{} is not a PNG: {e}", path.display()));
    let mut buf = vec![0; reader.output_buffer_size().expect("a sane PNG size")];
    let info = reader.next_frame(&mut buf).unwrap();
    let pixels = &buf[..info.buffer_size()];
    let channels = info.color_type.samples();
    // The picture is the page's viewport, which is the window less what
    // headless Chromium keeps for its own (no) toolbars.
    assert_eq!(
        (info.width, info.height),
        (view_w, view_h),
        "{}: not the viewport's size",
        path.display()
    );
    assert!(
        (WIDTH - 40..=WIDTH).contains(&view_w) && (HEIGHT / 2..=HEIGHT).contains(&view_h),
        "{}: {view_w}x{view_h}, not a {WIDTH}x{HEIGHT} window",
        path.display()
    );
    let mut counts = std::collections::HashMap::<[u8; 3], usize>::new();
    for px in pixels.chunks_exact(channels) {
        let rgb = if channels >= 3 {
            [px[0], px[1], px[2]]
        } else {
            [px[0], px[0], px[0]]
        };
        *counts.entry(rgb).or_default() += 1;
    }
    let total = pixels.len() / channels;
    let commonest = counts.values().copied().max().unwrap_or(0);
    // Text, borders and buttons give hundreds of colours (anti-aliasing);
    // a blank or failed page gives a handful.
    assert!(
        counts.len() > 64,
        "{}: only {} colours; the page did not render",
        path.display(),
        counts.len()
    );
    assert!(
        commonest * 100 < total * 95,
        "{}: one colour covers {commonest} of {total} pixels",
        path.display()
    );
}
