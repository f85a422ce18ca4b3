//! `GET /v1/openapi.json`: an OpenAPI 3.1 description of the whole HTTP
//! API, made from the code that serves it.
//!
//! Why generated: a hand-kept description drifts from the routes. Every
//! route is registered through [`Api`], which adds the handler to the
//! router and its [`Op`] to the description in one call, so a route cannot
//! be served without being described. Bodies are described by JSON
//! Schemas derived (with `schemars`) from the very request and reply types
//! that serde reads and writes, so a field renamed, added or made optional
//! changes the description with it.
//!
//! Open, with no token: it describes the API and holds no data.

use std::collections::BTreeMap;
use std::sync::Arc;

use axum::handler::Handler;
use axum::http::{header, Method};
use axum::response::IntoResponse;
use axum::routing::MethodRouter;
use axum::{Extension, Router};
use schemars::generate::{Contract, SchemaSettings};
use schemars::{JsonSchema, Schema, SchemaGenerator};
use serde_json::{json, Map, Value};

use crate::engine::Engine;

/// Where the description is served.
pub const PATH: &str = "/v1/openapi.json";

/// Who may call an operation.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Guard {
    /// Anyone.
    Open,
    /// A client key when keys are configured (bearer or HTTP Basic), else
    /// anyone; the admin token passes too.
    ClientKey,
    /// As [`Guard::ClientKey`], and signed when a signing secret is
    /// configured.
    SignedClientKey,
    /// A desk key or the admin token when either is configured.
    Desk,
    /// The admin token.
    Admin,
    /// The metrics token or the admin token.
    Metrics,
}

/// What an operation answers with `200` (or `204`).
#[derive(Clone, Copy)]
pub enum Body {
    /// A JSON body of a type with a schema.
    Json(fn(&mut SchemaGenerator) -> Schema),
    /// A body of another media type, described in words.
    Text(&'static str, &'static str),
    /// `204 No Content`.
    Empty,
}

/// The schema of `T`, as a [`Body::Json`] reads it.
pub fn schema<T: JsonSchema>(generator: &mut SchemaGenerator) -> Schema {
    generator.subschema_for::<T>()
}

/// A query parameter.
#[derive(Clone, Copy)]
pub struct Query {
    pub name: &'static str,
    pub description: &'static str,
    /// The JSON Schema type: `boolean`, `integer`.
    pub kind: &'static str,
}

/// One operation as the description gives it.
#[derive(Clone)]
pub struct Op {
    pub summary: &'static str,
    pub guard: Guard,
    /// The JSON body it reads, if any.
    pub request: Option<fn(&mut SchemaGenerator) -> Schema>,
    pub query: Vec<Query>,
    pub reply: Body,
    /// Headers of the reply worth naming, with what they say.
    pub reply_headers: Vec<(&'static str, &'static str)>,
    /// Error statuses of its own (beside those every route can answer and
    /// those its guard adds).
    pub errors: Vec<u16>,
}

impl Op {
    pub fn new(summary: &'static str, guard: Guard, reply: Body) -> Op {
        Op {
            summary,
            guard,
            request: None,
            query: Vec::new(),
            reply,
            reply_headers: Vec::new(),
            errors: Vec::new(),
        }
    }

    /// Reads a JSON body of type `T`: a malformed body is a 400, a wrong
    /// content type 415, one too large 413 and one of the wrong shape 422.
    pub fn reads<T: JsonSchema>(mut self) -> Op {
        self.request = Some(schema::<T>);
        self.errors.extend([400, 413, 415, 422]);
        self
    }

    pub fn query(
        mut self,
        name: &'static str,
        kind: &'static str,
        description: &'static str,
    ) -> Op {
        self.query.push(Query {
            name,
            description,
            kind,
        });
        self
    }

    pub fn header(mut self, name: &'static str, description: &'static str) -> Op {
        self.reply_headers.push((name, description));
        self
    }

    pub fn errors(mut self, statuses: &[u16]) -> Op {
        self.errors.extend_from_slice(statuses);
        self
    }
}

/// A described route.
#[derive(Clone)]
pub struct Endpoint {
    pub path: &'static str,
    pub method: Method,
    pub op: Op,
}

/// The router and the description of what it serves, built together.
pub struct Api {
    router: Router<Engine>,
    endpoints: Vec<Endpoint>,
}

impl Default for Api {
    fn default() -> Api {
        Api::new()
    }
}

impl Api {
    pub fn new() -> Api {
        Api {
            router: Router::new(),
            endpoints: Vec::new(),
        }
    }

    fn add(
        mut self,
        method: Method,
        path: &'static str,
        route: MethodRouter<Engine>,
        op: Op,
    ) -> Api {
        // Several methods on one path merge into one method router.
        self.router = self.router.route(path, route);
        self.endpoints.push(Endpoint { path, method, op });
        self
    }

    pub fn get<H: Handler<T, Engine>, T: 'static>(self, path: &'static str, h: H, op: Op) -> Api {
        self.add(Method::GET, path, axum::routing::get(h), op)
    }

    pub fn post<H: Handler<T, Engine>, T: 'static>(self, path: &'static str, h: H, op: Op) -> Api {
        self.add(Method::POST, path, axum::routing::post(h), op)
    }

    pub fn put<H: Handler<T, Engine>, T: 'static>(self, path: &'static str, h: H, op: Op) -> Api {
        self.add(Method::PUT, path, axum::routing::put(h), op)
    }

    pub fn delete<H: Handler<T, Engine>, T: 'static>(
        self,
        path: &'static str,
        h: H,
        op: Op,
    ) -> Api {
        self.add(Method::DELETE, path, axum::routing::delete(h), op)
    }

    /// Both tables together.
    pub fn merge(mut self, other: Api) -> Api {
        self.router = self.router.merge(other.router);
        self.endpoints.extend(other.endpoints);
        self
    }

    /// A layer on the routes so far (a body limit of their own).
    pub fn layer_routes(mut self, f: impl FnOnce(Router<Engine>) -> Router<Engine>) -> Api {
        self.router = f(self.router);
        self
    }

    /// The routes described so far.
    pub fn endpoints(&self) -> &[Endpoint] {
        &self.endpoints
    }

    /// Adds `GET /v1/openapi.json` and gives back the router, serving the
    /// description of every route in it, that one included.
    pub fn finish(self) -> Router<Engine> {
        let api = self.get(
            PATH,
            serve,
            Op::new(
                "This description of the API (OpenAPI 3.1)",
                Guard::Open,
                Body::Text(
                    "application/json",
                    "An OpenAPI 3.1 document describing every route.",
                ),
            ),
        );
        let document = Arc::new(document(&api.endpoints).to_string());
        api.router.layer(Extension(Description(document)))
    }
}

/// The description, written once when the router is built.
#[derive(Clone)]
struct Description(Arc<String>);

async fn serve(Extension(Description(text)): Extension<Description>) -> impl IntoResponse {
    (
        [(header::CONTENT_TYPE, "application/json")],
        text.as_str().to_owned(),
    )
}

/// The one error body every route answers its errors with.
#[derive(serde::Serialize, JsonSchema)]
pub struct ErrorBody {
    pub error: ErrorDetail,
}

/// What went wrong, for a program (`code`) and for a person (`message`).
#[derive(serde::Serialize, JsonSchema)]
pub struct ErrorDetail {
    /// Stable, snake_case: what a client branches on.
    pub code: String,
    /// A plain sentence saying what to do differently.
    pub message: String,
}

/// What each status means here, as the description words it.
fn status_text(status: u16) -> &'static str {
    match status {
        400 => "The body is not JSON, or a path segment is not valid UTF-8.",
        401 => "The credential is missing or wrong (or the message's signature does not check out).",
        403 => "This part of the API is off: no token is configured for it.",
        404 => "No such thing.",
        413 => "The body is larger than this route accepts.",
        415 => "The body is not sent as application/json.",
        422 => "The request parsed but cannot be used (the message says why).",
        429 => "Too many requests; the retry-after header says when to try again.",
        431 => "The request line and headers are too large.",
        503 => "Not available for now (a timeout, or the session store or shared data cannot be reached); try again.",
        _ => "An error.",
    }
}

/// The security requirements of a guard: any one of the alternatives.
fn security(guard: Guard) -> Option<Value> {
    let key = [json!({"clientKey": []}), json!({"clientKeyBasic": []})];
    let alternatives: Vec<Value> = match guard {
        Guard::Open => return None,
        // Keys are optional until configured: `{}` is "none needed".
        Guard::ClientKey => key
            .iter()
            .cloned()
            .chain([json!({"adminToken": []}), json!({})])
            .collect(),
        Guard::SignedClientKey => {
            let mut out = Vec::new();
            for base in key
                .iter()
                .cloned()
                .chain([json!({"adminToken": []}), json!({})])
            {
                let mut signed = base.clone();
                if let Some(m) = signed.as_object_mut() {
                    m.insert("signature".into(), json!([]));
                    m.insert("signatureTimestamp".into(), json!([]));
                }
                out.push(signed);
                out.push(base);
            }
            out
        }
        Guard::Desk => vec![
            json!({"clientKeyBasic": []}),
            json!({"adminTokenBasic": []}),
            json!({}),
        ],
        Guard::Admin => vec![json!({"adminToken": []})],
        Guard::Metrics => vec![json!({"metricsToken": []}), json!({"adminToken": []})],
    };
    Some(Value::Array(alternatives))
}

/// The error statuses a guard adds.
fn guard_errors(guard: Guard) -> &'static [u16] {
    match guard {
        Guard::Open => &[],
        Guard::ClientKey | Guard::SignedClientKey | Guard::Desk => &[401],
        // Failed logins are limited per address (429).
        Guard::Admin | Guard::Metrics => &[401, 403, 429],
    }
}

/// Statuses any route may answer: the head too large (431) and the
/// request time limit (503).
const EVERY_ROUTE: [u16; 2] = [431, 503];

/// The routes the per-source rate limit leaves out (a load balancer polls
/// them from one address).
pub const UNLIMITED: [&str; 2] = ["/healthz", "/readyz"];

/// The OpenAPI 3.1 document of `endpoints`.
pub fn document(endpoints: &[Endpoint]) -> Value {
    // Replies as serde writes them and requests as serde reads them: a
    // field with a default may be left out of a request, yet every reply
    // has it.
    let settings = |contract| {
        SchemaSettings::draft2020_12()
            .with(|s| {
                s.definitions_path = "/components/schemas".into();
                s.meta_schema = None;
                s.contract = contract;
            })
            .into_generator()
    };
    let mut generator = settings(Contract::Serialize);
    let mut reads = settings(Contract::Deserialize);
    let error_ref = generator.subschema_for::<ErrorBody>();
    let mut paths: BTreeMap<&str, Map<String, Value>> = BTreeMap::new();
    for e in endpoints {
        let mut op = Map::new();
        op.insert("summary".into(), json!(e.op.summary));
        op.insert("operationId".into(), json!(operation_id(&e.method, e.path)));
        let mut parameters: Vec<Value> = path_parameters(e.path)
            .into_iter()
            .map(|name| {
                json!({"name": name, "in": "path", "required": true, "schema": {"type": "string"}})
            })
            .collect();
        for q in &e.op.query {
            parameters.push(json!({
                "name": q.name, "in": "query", "required": false,
                "description": q.description, "schema": {"type": q.kind},
            }));
        }
        if !parameters.is_empty() {
            op.insert("parameters".into(), Value::Array(parameters));
        }
        if let Some(request) = e.op.request {
            op.insert(
                "requestBody".into(),
                json!({"required": true, "content": {"application/json": {"schema": request(&mut reads)}}}),
            );
        }
        if let Some(sec) = security(e.op.guard) {
            op.insert("security".into(), sec);
        }
        let mut responses = Map::new();
        let mut headers = Map::new();
        for (name, description) in &e.op.reply_headers {
            headers.insert(
                (*name).into(),
                json!({"description": description, "schema": {"type": "string"}}),
            );
        }
        let (status, ok) = match e.op.reply {
            Body::Json(schema) => (
                "200",
                json!({"description": "OK", "content": {"application/json": {"schema": schema(&mut generator)}}}),
            ),
            Body::Text(media, description) => (
                "200",
                json!({"description": description, "content": {media: {"schema": {"type": "string"}}}}),
            ),
            Body::Empty => ("204", json!({"description": "Done; no body."})),
        };
        let mut ok = ok;
        if !headers.is_empty() {
            if let Some(m) = ok.as_object_mut() {
                m.insert("headers".into(), Value::Object(headers));
            }
        }
        responses.insert(status.into(), ok);
        let mut errors: Vec<u16> = e.op.errors.clone();
        errors.extend_from_slice(guard_errors(e.op.guard));
        errors.extend_from_slice(&EVERY_ROUTE);
        if !UNLIMITED.contains(&e.path) {
            errors.push(429);
        }
        errors.sort_unstable();
        errors.dedup();
        for s in errors {
            let mut r = json!({
                "description": status_text(s),
                "content": {"application/json": {"schema": error_ref.clone()}},
            });
            if s == 429 {
                r["headers"] = json!({"retry-after": {"description": "Whole seconds to wait.", "schema": {"type": "integer"}}});
            }
            responses.insert(s.to_string(), r);
        }
        op.insert("responses".into(), Value::Object(responses));
        paths
            .entry(e.path)
            .or_default()
            .insert(e.method.as_str().to_ascii_lowercase(), Value::Object(op));
    }
    let mut schemas = generator.take_definitions(true);
    relax_explained(&mut schemas);
    let renamed = add_inputs(&mut schemas, reads.take_definitions(true));
    for item in paths.values_mut() {
        for op in item.values_mut() {
            if let Some(body) = op.get_mut("requestBody") {
                rename_refs(body, &renamed);
            }
        }
    }
    json!({
        "openapi": "3.1.0",
        "jsonSchemaDialect": "https://json-schema.org/draft/2020-12/schema",
        "info": {
            "title": "Tidings",
            "version": env!("CARGO_PKG_VERSION"),
            "description": "Answers readers' questions about results data on chat, SMS and voice. \
    Every error is answered with the ErrorBody shape. Any path not listed answers 404 (`not_found`), \
    a listed path with another method 405 (`method_not_allowed`, with an allow header).",
        },
        "paths": paths,
        "components": {
            "schemas": schemas,
            "securitySchemes": {
                "clientKey": {"type": "http", "scheme": "bearer",
                    "description": "A client key, when keys are configured (--client-keys)."},
                "clientKeyBasic": {"type": "http", "scheme": "basic",
                    "description": "A client key as the password of HTTP Basic (any user name); the desk needs a key marked desk."},
                "adminToken": {"type": "http", "scheme": "bearer",
                    "description": "The admin token (--admin-token); without one the admin API answers 403."},
                "adminTokenBasic": {"type": "http", "scheme": "basic",
                    "description": "The admin token as the password of HTTP Basic, for the desk page."},
                "metricsToken": {"type": "http", "scheme": "bearer",
                    "description": "The metrics token (--metrics-token) or the admin token."},
                "signature": {"type": "apiKey", "in": "header", "name": super::signature::SIGNATURE_HEADER,
                    "description": "Lowercase hex HMAC-SHA256 of `timestamp + \".\" + body` under the signing secret, when one is configured."},
                "signatureTimestamp": {"type": "apiKey", "in": "header", "name": super::signature::TIMESTAMP_HEADER,
                    "description": "The signing time in Unix seconds, within the window of the server's clock."},
            },
        },
    })
}

/// The message reply leaves out the fields that only explain it unless
/// the message asks for them (see [`super::reply`]), so they are not
/// required in its schema.
fn relax_explained(schemas: &mut Map<String, Value>) {
    let Some(required) = schemas
        .get_mut("Answer")
        .and_then(|a| a.get_mut("required"))
        .and_then(Value::as_array_mut)
    else {
        return;
    };
    required.retain(|r| {
        !r.as_str()
            .is_some_and(|r| super::reply::EXPLAIN_FIELDS.contains(&r))
    });
}

/// Adds the request-side definitions to the reply-side ones. A type whose
/// schema differs between the two (or refers to one that does) is added
/// as `{Name}Input`, with the references to it renamed; gives back the
/// renamed names.
fn add_inputs(
    schemas: &mut Map<String, Value>,
    inputs: Map<String, Value>,
) -> std::collections::BTreeSet<String> {
    let mut renamed = std::collections::BTreeSet::new();
    // Until no more change: renaming one may change those that refer to it.
    loop {
        let before = renamed.len();
        for (name, schema) in &inputs {
            if renamed.contains(name) {
                continue;
            }
            let mut mine = schema.clone();
            rename_refs(&mut mine, &renamed);
            if schemas.get(name).is_some_and(|theirs| *theirs != mine) {
                renamed.insert(name.clone());
            }
        }
        if renamed.len() == before {
            break;
        }
    }
    for (name, mut schema) in inputs {
        rename_refs(&mut schema, &renamed);
        let name = if renamed.contains(&name) {
            format!("{name}Input")
        } else {
            name
        };
        schemas.entry(name).or_insert(schema);
    }
    renamed
}

/// Points references to the names in `renamed` at their `Input` copies.
fn rename_refs(value: &mut Value, renamed: &std::collections::BTreeSet<String>) {
    match value {
        Value::Object(map) => {
            for (k, v) in map.iter_mut() {
                if k == "$ref" {
                    if let Some(name) = v
                        .as_str()
                        .and_then(|r| r.strip_prefix("#/components/schemas/"))
                        .filter(|n| renamed.contains(*n))
                    {
                        *v = Value::String(format!("#/components/schemas/{name}Input"));
                    }
                } else {
                    rename_refs(v, renamed);
                }
            }
        }
        Value::Array(items) => items.iter_mut().for_each(|v| rename_refs(v, renamed)),
        _ => {}
    }
}

/// The `{name}` segments of a path.
fn path_parameters(path: &str) -> Vec<&str> {
    path.split('/')
        .filter_map(|s| s.strip_prefix('{').and_then(|s| s.strip_suffix('}')))
        .collect()
}

/// A stable operation id: method and path in camel case
/// (`deleteV1UsersChannelUser`).
fn operation_id(method: &Method, path: &str) -> String {
    let mut id = method.as_str().to_ascii_lowercase();
    for word in path.split(|c: char| !c.is_ascii_alphanumeric()) {
        let mut chars = word.chars();
        if let Some(first) = chars.next() {
            id.push(first.to_ascii_uppercase());
            id.extend(chars);
        }
    }
    id
}

/// `Scored` (in the understanding, which shapes it) written as its serde
/// derive writes it; the explained reply examples in docs/api.md are
/// checked against this schema, so a change to the type shows there.
impl JsonSchema for crate::understand::classify::Scored {
    fn schema_name() -> std::borrow::Cow<'static, str> {
        "Scored".into()
    }

    fn json_schema(_: &mut SchemaGenerator) -> Schema {
        schemars::json_schema!({
            "description": "One intent's score and why.",
            "type": "object",
            "properties": {
                "intent": {"type": "string"},
                "score": {"type": "number"},
                "example": {"type": "string", "description": "The example phrasing that matched best."},
                "shared": {"type": "array", "items": {"type": "string"},
                    "description": "Words and placeholders the message shared with it."},
            },
            "required": ["intent", "score", "example", "shared"],
            "additionalProperties": false,
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn operation_ids_and_path_parameters() {
        assert_eq!(
            operation_id(&Method::DELETE, "/v1/users/{channel}/{user}"),
            "deleteV1UsersChannelUser"
        );
        assert_eq!(
            operation_id(&Method::GET, "/desk/desk.css"),
            "getDeskDeskCss"
        );
        assert_eq!(
            path_parameters("/v1/users/{channel}/{user}"),
            ["channel", "user"]
        );
        assert!(path_parameters("/healthz").is_empty());
    }

    #[test]
    fn request_forms_that_differ_are_added_as_inputs_with_their_references() {
        let r = |name: &str| json!({"$ref": format!("#/components/schemas/{name}")});
        let mut schemas = Map::new();
        schemas.insert("Leaf".into(), json!({"required": ["a", "b"]}));
        schemas.insert("Outer".into(), json!({"items": r("Leaf")}));
        schemas.insert("Same".into(), json!({"type": "string"}));
        let mut inputs = Map::new();
        inputs.insert("Leaf".into(), json!({"required": ["a"]}));
        // The same as the reply's, but it refers to a type that differs.
        inputs.insert("Outer".into(), json!({"items": r("Leaf")}));
        inputs.insert("Same".into(), json!({"type": "string"}));
        inputs.insert("OnlyIn".into(), json!({"items": r("Outer")}));
        let renamed = add_inputs(&mut schemas, inputs);
        assert_eq!(renamed.into_iter().collect::<Vec<_>>(), ["Leaf", "Outer"]);
        assert_eq!(schemas["LeafInput"], json!({"required": ["a"]}));
        assert_eq!(schemas["OuterInput"], json!({"items": r("LeafInput")}));
        assert_eq!(schemas["OnlyIn"], json!({"items": r("OuterInput")}));
        assert_eq!(schemas["Outer"], json!({"items": r("Leaf")}));
        assert!(!schemas.contains_key("SameInput"));
    }
}
