//! `GET /v1/openapi.json` from a real server: a valid OpenAPI 3.1
//! document, describing every route the server answers, and matching the
//! examples of docs/api.md.
//!
//! External checks: the document is validated by `openapi-spec-validator`
//! (PyPI, `openapi_spec_validator.validate`, which checks a document
//! against the OpenAPI Initiative's schema of its version), and the
//! examples by `jsonschema` (PyPI, `Draft202012Validator`, the JSON Schema
//! dialect OpenAPI 3.1 uses), both run with the Python of the venv
//! `tests/run.sh` installs them into (`TIDINGS_OPENAPI_PYTHON`).

mod common;

use std::io::Write;
use std::process::{Command, Stdio};

use common::Server;
use serde_json::{json, Value};

const ADMIN_TOKEN: &str = "admin-token-for-the-openapi-test";

/// The Python that has `openapi_spec_validator` and `jsonschema`.
/// Missing, the test fails: it never skips silently.
fn python() -> String {
    std::env::var("TIDINGS_OPENAPI_PYTHON").unwrap_or_else(|_| {
        panic!("TIDINGS_OPENAPI_PYTHON is not set: run the tests with `bash tests/run.sh`, which installs openapi-spec-validator and jsonschema into a venv")
    })
}

/// Runs `script` with `input` on stdin and gives back its stdout, failing
/// the test with its stderr when it exits non-zero.
fn run_python(script: &str, input: &Value) -> String {
    let mut child = Command::new(python())
        .args(["-c", script])
        .stdin(Stdio::piped())
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .expect("the venv's python runs");
    child
        .stdin
        .take()
        .unwrap()
        .write_all(input.to_string().as_bytes())
        .unwrap();
    let out = child.wait_with_output().unwrap();
    assert!(
        out.status.success(),
        "python failed:\n{}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout).unwrap()
}

async fn server() -> Server {
    let mut settings = common::test_settings();
    settings.admin_token = Some(ADMIN_TOKEN.into());
    let snap = tidings::engine::load(&tidings::engine::Sources::default()).unwrap();
    let engine = tidings::engine::Engine::new(
        snap,
        std::sync::Arc::new(tidings::dialogue::MemoryStore::new()),
        settings,
    );
    Server::start(engine).await
}

/// The served description, fetched with no credential at all.
async fn fetch(server: &Server) -> Value {
    let r = server
        .client
        .get(server.url("/v1/openapi.json"))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 200);
    assert_eq!(r.headers()["content-type"], "application/json");
    r.json().await.unwrap()
}

/// A JSON pointer segment (RFC 6901).
fn escape(segment: &str) -> String {
    segment.replace('~', "~0").replace('/', "~1")
}

fn docs() -> String {
    std::fs::read_to_string(concat!(env!("CARGO_MANIFEST_DIR"), "/docs/api.md")).unwrap()
}

#[tokio::test]
async fn openapi_spec_validator_accepts_the_served_description() {
    let s = server().await;
    let doc = fetch(&s).await;
    assert_eq!(doc["openapi"], "3.1.0");
    // openapi-spec-validator (PyPI): `validate` picks the schema of the
    // document's version and raises on the first problem.
    let out = run_python(
        r##"
import json, sys
from openapi_spec_validator import validate
from openapi_spec_validator.versions.shortcuts import get_spec_version
doc = json.load(sys.stdin)
validate(doc)
print(get_spec_version(doc))
"##,
        &doc,
    );
    assert!(out.contains("3.1"), "validated as {out}");
}

#[tokio::test]
async fn each_route_names_its_statuses_auth_and_the_one_error_body() {
    let s = server().await;
    let doc = fetch(&s).await;
    let op = |path: &str, method: &str| doc["paths"][path][method].clone();
    let statuses = |o: &Value| -> Vec<String> {
        o["responses"]
            .as_object()
            .unwrap()
            .keys()
            .cloned()
            .collect()
    };
    let messages = op("/v1/messages", "post");
    for status in ["200", "400", "401", "413", "415", "422", "429", "503"] {
        assert!(
            statuses(&messages).contains(&status.to_string()),
            "POST /v1/messages lacks {status}"
        );
    }
    for (path, method) in [
        ("/v1/admin/batches", "post"),
        ("/v1/admin/dataset", "put"),
        ("/v1/admin/dataset", "get"),
        ("/v1/admin/status", "get"),
        ("/v1/admin/unanswered", "get"),
        ("/metrics", "get"),
    ] {
        let o = op(path, method);
        for status in ["401", "403", "429"] {
            assert!(
                statuses(&o).contains(&status.to_string()),
                "{method} {path} lacks {status}"
            );
        }
        assert!(o["security"].as_array().is_some_and(|s| !s.is_empty()));
    }
    assert!(statuses(&op("/v1/users/{channel}/{user}", "delete")).contains(&"204".into()));
    // The description itself and the health checks need nothing.
    for path in ["/v1/openapi.json", "/healthz", "/readyz"] {
        assert!(op(path, "get")["security"].is_null(), "{path} is open");
    }
    // Signed messages: the two headers together, as one alternative.
    assert!(messages["security"]
        .as_array()
        .unwrap()
        .contains(&json!({"clientKey": [], "signature": [], "signatureTimestamp": []})));
    let schemes = &doc["components"]["securitySchemes"];
    for name in [
        "clientKey",
        "clientKeyBasic",
        "adminToken",
        "metricsToken",
        "signature",
        "signatureTimestamp",
    ] {
        assert!(schemes[name].is_object(), "no security scheme {name}");
    }
    assert_eq!(schemes["signature"]["name"], "tidings-signature");
    // The reply as written: fields always sent are required, the ones
    // that only explain it (sent with `"explain": true`) are not.
    let answer = &doc["components"]["schemas"]["Answer"]["required"];
    let answer: Vec<&str> = answer
        .as_array()
        .unwrap()
        .iter()
        .filter_map(Value::as_str)
        .collect();
    for field in [
        "text",
        "intent",
        "outcome",
        "detail",
        "dataset_version",
        "as_of",
    ] {
        assert!(answer.contains(&field), "Answer does not require {field}");
    }
    assert!(!answer.contains(&"facts") && !answer.contains(&"candidates"));
    // A request may leave out a field with a default (MessageIn's
    // `channel`), a reply never does.
    let required = &doc["components"]["schemas"]["MessageIn"]["required"];
    assert_eq!(*required, json!(["user", "text"]));
    // Every error of every route has the one error body.
    for (path, item) in doc["paths"].as_object().unwrap() {
        for (method, o) in item.as_object().unwrap() {
            for (status, r) in o["responses"].as_object().unwrap() {
                if status.starts_with('4') || status.starts_with('5') {
                    assert_eq!(
                        r["content"]["application/json"]["schema"]["$ref"],
                        "#/components/schemas/ErrorBody",
                        "{method} {path} {status}"
                    );
                }
            }
        }
    }
}

/// A concrete path for a described one.
fn concrete(path: &str) -> String {
    path.replace("{channel}", "chat")
        .replace("{user}", "openapi-probe")
}

#[tokio::test]
async fn every_route_the_server_answers_is_described() {
    let s = server().await;
    let doc = fetch(&s).await;
    let paths = doc["paths"].as_object().unwrap();
    // On every described path, a described method is served (not 404 or
    // 405) and any other method is 405: so no method is served there
    // without being described.
    for (path, item) in paths {
        for method in ["GET", "POST", "PUT", "DELETE", "PATCH"] {
            let described = item.get(method.to_ascii_lowercase()).is_some();
            // With the credential each guard takes, so the answer is the
            // router's, not a guard's refusal in front of it.
            let request = s
                .client
                .request(method.parse().unwrap(), s.url(&concrete(path)));
            let request = if path.starts_with("/desk") {
                request.basic_auth("editor", Some(ADMIN_TOKEN))
            } else {
                request.bearer_auth(ADMIN_TOKEN)
            };
            let status = request.send().await.unwrap().status().as_u16();
            if described {
                assert!(
                    status != 404 && status != 405,
                    "{method} {path} is described but answers {status}"
                );
            } else {
                assert_eq!(status, 405, "{method} {path} is served but not described");
            }
        }
    }
    // Every route the guide has a section for, and every route in the
    // README's prose, is described.
    let mut named = Vec::new();
    for line in docs().lines() {
        let Some(heading) = line.strip_prefix("## ").or(line.strip_prefix("### ")) else {
            continue;
        };
        for part in heading.split(" and ") {
            if let Some((method, path)) = part.trim().split_once(' ') {
                if ["GET", "POST", "PUT", "DELETE"].contains(&method) && path.starts_with('/') {
                    named.push((method.to_ascii_lowercase(), path.to_string()));
                }
            }
        }
    }
    assert!(named.len() >= 10, "the guide's route headings: {named:?}");
    assert!(named.contains(&("get".into(), "/v1/openapi.json".into())));
    for (method, path) in named {
        assert!(
            doc["paths"][&path][&method].is_object(),
            "docs/api.md has {method} {path}, the description does not"
        );
    }
    // The guide's overview table lists every described route but the
    // desk page's own files.
    let guide = docs();
    for (path, item) in paths {
        for method in item.as_object().unwrap().keys() {
            let row = format!("| `{} {path}` |", method.to_ascii_uppercase());
            assert!(
                path.starts_with("/desk/") || guide.contains(&row),
                "docs/api.md's overview has no row {row}"
            );
        }
    }
    // A path nobody serves is 404 in the one error shape.
    let r = s.client.get(s.url("/v1/nothing")).send().await.unwrap();
    assert_eq!(r.status(), 404);
}

/// A ```json block of the guide and what its info string says it is:
/// `json METHOD PATH request|STATUS [field=NAME] [abridged] [lines]`.
struct Example {
    line: usize,
    info: String,
    text: String,
}

fn json_blocks(markdown: &str) -> Vec<Example> {
    use pulldown_cmark::{CodeBlockKind, Event, Parser, Tag, TagEnd};
    let mut out = Vec::new();
    let mut current: Option<Example> = None;
    for (event, range) in Parser::new(markdown).into_offset_iter() {
        match event {
            Event::Start(Tag::CodeBlock(CodeBlockKind::Fenced(info)))
                if info.split_whitespace().next() == Some("json") =>
            {
                current = Some(Example {
                    line: markdown[..range.start].lines().count() + 1,
                    info: info.to_string(),
                    text: String::new(),
                })
            }
            Event::Text(t) => {
                if let Some(e) = &mut current {
                    e.text.push_str(&t)
                }
            }
            Event::End(TagEnd::CodeBlock) => out.extend(current.take()),
            _ => {}
        }
    }
    out
}

/// Follows a `$ref` to the components, else gives the pointer back.
fn resolve(doc: &Value, pointer: &str) -> String {
    match doc.pointer(pointer).and_then(|s| s["$ref"].as_str()) {
        Some(r) => r.trim_start_matches('#').to_string(),
        None => pointer.to_string(),
    }
}

/// The (schema pointer, instance) pairs an example stands for.
fn checks(doc: &Value, e: &Example) -> Vec<(String, Value)> {
    let words: Vec<&str> = e.info.split_whitespace().collect();
    let [_, method, path, what, flags @ ..] = words.as_slice() else {
        panic!(
            "docs/api.md line {}: a JSON example says what it is: `json METHOD PATH request|STATUS`, not `{}`",
            e.line, e.info
        )
    };
    let op = format!("/paths/{}/{}", escape(path), method.to_ascii_lowercase());
    assert!(
        doc.pointer(&op).is_some(),
        "docs/api.md line {}: {method} {path} is not described",
        e.line
    );
    let mut pointer = if *what == "request" {
        format!("{op}/requestBody/content/application~1json/schema")
    } else {
        format!("{op}/responses/{what}/content/application~1json/schema")
    };
    assert!(
        doc.pointer(&pointer).is_some(),
        "docs/api.md line {}: {method} {path} has no JSON {what} body",
        e.line
    );
    for f in flags {
        if let Some(field) = f.strip_prefix("field=") {
            pointer = format!("{}/properties/{}", resolve(doc, &pointer), escape(field));
            assert!(
                doc.pointer(&pointer).is_some(),
                "docs/api.md line {}: no field {field}",
                e.line
            );
        }
    }
    let abridged = flags.contains(&"abridged");
    let texts: Vec<String> = if flags.contains(&"lines") {
        e.text
            .lines()
            .filter(|l| !l.trim().is_empty())
            .map(str::to_string)
            .collect()
    } else if abridged {
        // `, ...}` marks fields left out of the example.
        vec![e.text.replace(", ...}", "}")]
    } else {
        vec![e.text.clone()]
    };
    let mut out = Vec::new();
    for t in texts {
        let value: Value = serde_json::from_str(&t)
            .unwrap_or_else(|err| panic!("docs/api.md line {}: not JSON: {err}", e.line));
        if abridged {
            // Each field shown fits its own schema.
            let object = resolve(doc, &pointer);
            for (k, v) in value.as_object().expect("an abridged example is an object") {
                let field = format!("{object}/properties/{}", escape(k));
                assert!(
                    doc.pointer(&field).is_some(),
                    "docs/api.md line {}: {k} is not a field",
                    e.line
                );
                out.push((field, v.clone()));
            }
        } else {
            out.push((pointer.clone(), value));
        }
    }
    out
}

#[tokio::test]
async fn every_json_example_in_the_api_guide_fits_the_served_schema() {
    let s = server().await;
    let doc = fetch(&s).await;
    let examples = json_blocks(&docs());
    assert!(examples.len() >= 15, "{} JSON examples", examples.len());
    let mut items = Vec::new();
    for e in &examples {
        for (pointer, instance) in checks(&doc, e) {
            items.push(json!({
                "where": format!("docs/api.md line {} ({})", e.line, e.info),
                "pointer": format!("#{pointer}"),
                "instance": instance,
            }));
        }
    }
    // jsonschema (PyPI): the served document is the root schema, so its
    // `#/components/schemas/...` references resolve as a client's would.
    let out = run_python(
        r##"
import json, sys
from jsonschema import Draft202012Validator
data = json.load(sys.stdin)
problems = []
for item in data["items"]:
    root = dict(data["doc"])
    root["$ref"] = item["pointer"]
    for e in Draft202012Validator(root).iter_errors(item["instance"]):
        problems.append(f'{item["where"]}: at {e.json_path}: {e.message}')
print(json.dumps({"checked": len(data["items"]), "problems": problems}))
"##,
        &json!({"doc": doc, "items": items}),
    );
    let result: Value = serde_json::from_str(&out).unwrap();
    assert_eq!(result["problems"], json!([]), "{result:#}");
    assert_eq!(result["checked"], items.len());
    // The checker is live: an example with a field of the wrong type fails.
    let out = run_python(
        r##"
import json, sys
from jsonschema import Draft202012Validator
data = json.load(sys.stdin)
root = dict(data["doc"]); root["$ref"] = "#/components/schemas/Health"
print(len(list(Draft202012Validator(root).iter_errors({"dataset_version": "one", "intents": 1, "status": "ok"}))))
"##,
        &json!({"doc": doc}),
    );
    assert_eq!(out.trim(), "1");
}

/// The example of `info` in the guide, parsed.
fn example(info: &str) -> Value {
    let e = json_blocks(&docs())
        .into_iter()
        .find(|e| e.info == info)
        .unwrap_or_else(|| panic!("docs/api.md has no ```{info} example"));
    serde_json::from_str(&e.text).unwrap()
}

#[tokio::test]
async fn the_health_and_status_figures_in_the_guide_are_the_demos() {
    let s = server().await;
    let served: Value = s
        .client
        .get(s.url("/healthz"))
        .send()
        .await
        .unwrap()
        .json()
        .await
        .unwrap();
    assert_eq!(
        example("json GET /healthz 200"),
        served,
        "docs/api.md's /healthz example is not what the demo serves"
    );
    let status: Value = s
        .client
        .get(s.url("/v1/admin/status"))
        .bearer_auth(ADMIN_TOKEN)
        .send()
        .await
        .unwrap()
        .json()
        .await
        .unwrap();
    let documented = example("json GET /v1/admin/status 200");
    for field in ["scenario", "channels"] {
        assert_eq!(documented[field], status[field], "{field}");
    }
    // The intents are shown abridged: the ones shown are served, in order.
    let shown: Vec<&Value> = documented["intents"]
        .as_array()
        .unwrap()
        .iter()
        .filter(|i| *i != "...")
        .collect();
    let intents = status["intents"].as_array().unwrap();
    assert!(shown.iter().all(|i| intents.contains(i)), "{shown:?}");
    // The readiness example has the fields served, with a store of redis.
    let ready: Value = s
        .client
        .get(s.url("/readyz"))
        .send()
        .await
        .unwrap()
        .json()
        .await
        .unwrap();
    let documented = example("json GET /readyz 200");
    let keys = |v: &Value| -> Vec<String> { v.as_object().unwrap().keys().cloned().collect() };
    assert_eq!(keys(&documented), keys(&ready));
    assert_eq!(ready["dataset_version"], documented["dataset_version"]);
}
