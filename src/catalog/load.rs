//! Reading intent YAML and checking it against the operations.

use std::collections::{BTreeMap, HashMap, HashSet};
use std::fmt;
use std::path::Path;

use serde::Deserialize;
use serde_saphyr::Spanned;

use super::{Catalog, Focus, Honoured, Intent, ServiceWording, SlotDef, Template};
use crate::answers::channel::Channels;
use crate::answers::ops::{self, EntityKind};
use crate::understand::vocabulary::{Vocabulary, VocabularyFile, VOCABULARY_FILE};

/// One problem in a catalog file.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub struct CatalogProblem {
    pub file: String,
    pub line: u64,
    pub column: u64,
    pub message: String,
}

impl fmt::Display for CatalogProblem {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(
            f,
            "{}:{}:{}: {}",
            self.file, self.line, self.column, self.message
        )
    }
}

/// Why a catalog could not be loaded: every problem found.
#[derive(Debug, Clone, thiserror::Error)]
#[error("{}", .0.iter().map(|p| p.to_string()).collect::<Vec<_>>().join("\n"))]
pub struct CatalogError(pub Vec<CatalogProblem>);

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct IntentFile {
    intent: Spanned<String>,
    #[serde(default)]
    summary: Option<String>,
    operation: Spanned<String>,
    /// What the intent answers (focus names).
    #[serde(default)]
    answers: Option<Spanned<Vec<Spanned<String>>>>,
    /// Limits it honours beyond its slots.
    #[serde(default)]
    honours: Vec<Spanned<String>>,
    phrasings: Vec<Spanned<String>>,
    #[serde(default)]
    slots: BTreeMap<String, Spanned<SlotFile>>,
    replies: Spanned<BTreeMap<String, Spanned<String>>>,
    /// Wording for one channel, by outcome, over `replies`.
    #[serde(default)]
    channel_replies: BTreeMap<String, BTreeMap<String, Spanned<String>>>,
    #[serde(default)]
    settings: BTreeMap<String, String>,
    #[serde(default)]
    suggestions: Vec<Spanned<String>>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct SlotFile {
    entity: Spanned<String>,
    #[serde(default)]
    required: Option<bool>,
    #[serde(default)]
    ask: Option<String>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct ServiceFile {
    not_understood: Spanned<String>,
    choose: Spanned<String>,
    reset: Spanned<String>,
    /// A topic the data does not hold (`{what}`).
    #[serde(default)]
    not_covered: Option<Spanned<String>>,
    /// A limit no intent honours (`{limits}`).
    #[serde(default)]
    cannot_limit: Option<Spanned<String>>,
    /// A focus no intent answers (`{what}`).
    #[serde(default)]
    cannot_answer: Option<Spanned<String>>,
    #[serde(default)]
    examples: Vec<String>,
    /// Wording for one channel, by key (`not_understood`, `choose`, `reset`).
    #[serde(default)]
    channel_wording: BTreeMap<String, BTreeMap<String, Spanned<String>>>,
}

/// The file of an intents folder that adds or replaces channel profiles.
pub const CHANNELS_FILE: &str = "channels.yaml";

/// The file holding service-wide wording in an intents folder.
pub const SERVICE_FILE: &str = "service.yaml";

/// Loads every `*.yaml` file of an intents folder.
pub fn load_dir(dir: &Path) -> Result<Catalog, CatalogError> {
    let entries = std::fs::read_dir(dir).map_err(|e| {
        CatalogError(vec![CatalogProblem {
            file: dir.display().to_string(),
            line: 0,
            column: 0,
            message: format!("cannot read the folder: {e}"),
        }])
    })?;
    let mut files = Vec::new();
    for entry in entries.flatten() {
        let path = entry.path();
        if path.extension().is_some_and(|e| e == "yaml" || e == "yml") {
            match std::fs::read_to_string(&path) {
                Ok(text) => files.push((path.display().to_string(), text)),
                Err(e) => {
                    return Err(CatalogError(vec![CatalogProblem {
                        file: path.display().to_string(),
                        line: 0,
                        column: 0,
                        message: format!("cannot read: {e}"),
                    }]))
                }
            }
        }
    }
    files.sort();
    load_texts(&files)
}

/// Loads a catalog from (file name, text) pairs; the service file is the one
/// whose name ends with `service.yaml`.
pub fn load_texts(files: &[(String, String)]) -> Result<Catalog, CatalogError> {
    let mut problems = Vec::new();
    let mut intents = Vec::new();
    let mut service = None;
    let mut names: HashMap<String, String> = HashMap::new();
    let mut channels = Channels::built_in();
    for (file, text) in files.iter().filter(|(f, _)| f.ends_with(CHANNELS_FILE)) {
        channels = Channels::with_file(file, text, &mut problems);
    }
    let mut vocabulary = Vocabulary::default();
    let mut vocabulary_file = None;
    for (file, text) in files.iter().filter(|(f, _)| f.ends_with(VOCABULARY_FILE)) {
        vocabulary_file = Some(file.clone());
        match serde_saphyr::from_str::<VocabularyFile>(text) {
            Ok(v) => {
                match Vocabulary::from_file(v) {
                    Ok(v) => vocabulary = v,
                    Err(ps) => problems.extend(ps.into_iter().map(|(line, column, message)| {
                        CatalogProblem {
                            file: file.clone(),
                            line,
                            column,
                            message,
                        }
                    })),
                }
            }
            Err(e) => problems.push(yaml_problem(file, &e)),
        }
    }
    for (file, text) in files {
        if file.ends_with(CHANNELS_FILE) || file.ends_with(VOCABULARY_FILE) {
            continue;
        }
        if file.ends_with(SERVICE_FILE) {
            match serde_saphyr::from_str::<ServiceFile>(text) {
                Ok(s) => service = service_wording(file, s, &channels, &mut problems),
                Err(e) => problems.push(yaml_problem(file, &e)),
            }
            continue;
        }
        match serde_saphyr::from_str::<IntentFile>(text) {
            Ok(f) => {
                if let Some(i) = check_intent(file, f, &channels, &mut problems) {
                    if let Some(other) = names.insert(i.name.clone(), file.clone()) {
                        problems.push(CatalogProblem {
                            file: file.clone(),
                            line: 1,
                            column: 1,
                            message: format!("intent {:?} is already defined in {other}", i.name),
                        });
                    }
                    intents.push(i);
                }
            }
            Err(e) => problems.push(yaml_problem(file, &e)),
        }
    }
    if service.is_none() && !problems.iter().any(|p| p.file.ends_with(SERVICE_FILE)) {
        problems.push(CatalogProblem {
            file: SERVICE_FILE.into(),
            line: 0,
            column: 0,
            message: "the intents folder needs a service.yaml with not_understood, choose and reset wording".into(),
        });
    }
    if intents.is_empty() && problems.is_empty() {
        problems.push(CatalogProblem {
            file: "intents".into(),
            line: 0,
            column: 0,
            message: "no intents found".into(),
        });
    }
    if let Some(file) = &vocabulary_file {
        check_vocabulary(file, &vocabulary, &intents, &mut problems);
    }
    if !problems.is_empty() {
        return Err(CatalogError(problems));
    }
    Ok(Catalog {
        intents,
        service: service.expect("checked above"),
        channels,
        vocabulary,
    })
}

/// A synonym must stand for words some phrasing uses, or it changes
/// nothing: the reader's word would still be read as unknown.
fn check_vocabulary(
    file: &str,
    v: &Vocabulary,
    intents: &[Intent],
    problems: &mut Vec<CatalogProblem>,
) {
    let mut words: HashSet<String> = HashSet::new();
    for i in intents {
        for p in &i.phrasings {
            let mut rest = p.as_str();
            // Placeholders are not words.
            while let Some(open) = rest.find('{') {
                words.extend(
                    crate::understand::normalize::normalize(&rest[..open])
                        .split(' ')
                        .map(String::from),
                );
                rest = rest[open..].find('}').map_or("", |c| &rest[open + c + 1..]);
            }
            words.extend(
                crate::understand::normalize::normalize(rest)
                    .split(' ')
                    .map(String::from),
            );
        }
    }
    let mut reported = HashSet::new();
    for (_, to) in &v.same_as {
        for w in to {
            if !words.contains(w) && reported.insert(w.clone()) {
                problems.push(CatalogProblem {
                    file: file.to_string(),
                    line: 0,
                    column: 0,
                    message: format!("same_as: {w:?} is not a word of any phrasing, so readers' words for it would change nothing"),
                });
            }
        }
    }
}

/// A YAML syntax or shape problem, located.
pub fn yaml_problem(file: &str, e: &serde_saphyr::Error) -> CatalogProblem {
    let (line, column) = e
        .location()
        .map(|l| (l.line(), l.column()))
        .unwrap_or((0, 0));
    // The library's message may carry a source snippet on later lines; the
    // first line is the sentence an editor needs.
    let full = e.to_string();
    let message = full
        .lines()
        .find(|l| !l.trim().is_empty())
        .unwrap_or("invalid YAML")
        .trim()
        .to_string();
    CatalogProblem {
        file: file.to_string(),
        line,
        column,
        message,
    }
}

fn at<T>(file: &str, s: &Spanned<T>, message: String) -> CatalogProblem {
    CatalogProblem {
        file: file.to_string(),
        line: s.referenced.line(),
        column: s.referenced.column(),
        message,
    }
}

fn template(
    file: &str,
    s: &Spanned<String>,
    problems: &mut Vec<CatalogProblem>,
) -> Option<Template> {
    match Template::parse(&s.value) {
        Ok(t) => Some(t),
        Err(e) => {
            problems.push(CatalogProblem {
                file: file.to_string(),
                line: s.referenced.line(),
                // Points into the string; the opening quote, if any, is not counted.
                column: s.referenced.column() + e.offset as u64,
                message: e.message,
            });
            None
        }
    }
}

fn service_wording(
    file: &str,
    s: ServiceFile,
    channels: &Channels,
    problems: &mut Vec<CatalogProblem>,
) -> Option<ServiceWording> {
    let allowed: [(&Spanned<String>, &[&str]); 3] = [
        (&s.not_understood, &["examples"]),
        (&s.choose, &["options", "noun"]),
        (&s.reset, &[]),
    ];
    let mut out = Vec::new();
    for (spanned, names) in allowed {
        let Some(t) = template(file, spanned, problems) else {
            continue;
        };
        for n in t.names() {
            if !names.contains(&n) {
                problems.push(at(
                    file,
                    spanned,
                    format!(
                        "placeholder {{{n}}} is not available here; use {}",
                        list_or_none(names)
                    ),
                ));
            }
        }
        out.push(t);
    }
    if out.len() != 3 {
        return None;
    }
    let reset = out.pop()?;
    let choose = out.pop()?;
    let not_understood = out.pop()?;
    // The honest replies have built-in wording an editor may replace.
    let mut optional = |given: &Option<Spanned<String>>, default: &str, names: &[&str]| {
        let t = match given {
            Some(spanned) => {
                let t = template(file, spanned, problems)?;
                for n in t.names() {
                    if !names.contains(&n) {
                        problems.push(at(
                            file,
                            spanned,
                            format!(
                                "placeholder {{{n}}} is not available here; use {}",
                                list_or_none(names)
                            ),
                        ));
                    }
                }
                t
            }
            None => Template::parse(default).expect("built-in wording parses"),
        };
        Some(t)
    };
    let not_covered = optional(&s.not_covered, DEFAULT_NOT_COVERED, SERVICE_NAMES[3].1)?;
    let cannot_limit = optional(&s.cannot_limit, DEFAULT_CANNOT_LIMIT, SERVICE_NAMES[4].1)?;
    let cannot_answer = optional(&s.cannot_answer, DEFAULT_CANNOT_ANSWER, SERVICE_NAMES[5].1)?;
    let mut by_channel: HashMap<String, HashMap<String, Template>> = HashMap::new();
    for (channel, wording) in &s.channel_wording {
        check_channel(
            file,
            "channel_wording",
            channel,
            wording,
            channels,
            problems,
        );
        for (key, text) in wording {
            let Some((_, names)) = SERVICE_NAMES.iter().find(|(k, _)| k == key) else {
                problems.push(at(
                    file,
                    text,
                    format!(
                        "channel_wording: {key:?} is not service wording; use {}",
                        SERVICE_NAMES
                            .iter()
                            .map(|(k, _)| *k)
                            .collect::<Vec<_>>()
                            .join(", ")
                    ),
                ));
                continue;
            };
            let Some(t) = template(file, text, problems) else {
                continue;
            };
            for n in t.names() {
                if !names.contains(&n) {
                    problems.push(at(
                        file,
                        text,
                        format!(
                            "placeholder {{{n}}} is not available here; use {}",
                            list_or_none(names)
                        ),
                    ));
                }
            }
            by_channel
                .entry(channel.clone())
                .or_default()
                .insert(key.clone(), t);
        }
    }
    Some(ServiceWording {
        not_understood,
        choose,
        reset,
        not_covered,
        cannot_limit,
        cannot_answer,
        examples: s.examples,
        by_channel,
    })
}

/// Service wording keys and the placeholders each may use.
pub const SERVICE_NAMES: [(&str, &[&str]); 6] = [
    ("not_understood", &["examples"]),
    ("choose", &["options", "noun"]),
    ("reset", &[]),
    ("not_covered", &["what"]),
    ("cannot_limit", &["limits"]),
    ("cannot_answer", &["what"]),
];

/// Built-in wording for a topic the data does not hold.
pub const DEFAULT_NOT_COVERED: &str = "Sorry, I don't have {what}.";
/// Built-in wording for a limit no intent honours.
pub const DEFAULT_CANNOT_LIMIT: &str = "Sorry, I can't answer that for {limits|and} on its own.";
/// Built-in wording for a focus no intent answers.
pub const DEFAULT_CANNOT_ANSWER: &str = "Sorry, I can't tell you {what} from these results.";

/// A channel named in `channel_replies` or `channel_wording` must be a
/// profile: the built-in ones or the folder's own `channels.yaml`, which is
/// read before any other file. The problem is placed at the first wording
/// under the channel's name.
fn check_channel(
    file: &str,
    what: &str,
    channel: &str,
    wording: &BTreeMap<String, Spanned<String>>,
    channels: &Channels,
    problems: &mut Vec<CatalogProblem>,
) {
    if channels.get(channel).is_some() {
        return;
    }
    let message = format!(
        "{what}: no channel {channel:?}; the channels are {}",
        channels.names().join(", ")
    );
    problems.push(match wording.values().next() {
        Some(t) => at(file, t, message),
        None => CatalogProblem {
            file: file.to_string(),
            line: 0,
            column: 0,
            message,
        },
    });
}

/// Every placeholder of an outcome's wording must name a slot or a fact
/// of that outcome.
fn check_names(
    file: &str,
    text: &Spanned<String>,
    t: &Template,
    outcome: &str,
    declared: &HashSet<&str>,
    facts: &[&str],
    problems: &mut Vec<CatalogProblem>,
) {
    for n in t.names() {
        if !declared.contains(n) && !facts.contains(&n) {
            let available: Vec<&str> = declared
                .iter()
                .copied()
                .chain(facts.iter().copied())
                .collect();
            problems.push(at(
                file,
                text,
                format!(
                    "placeholder {{{n}}} names no slot and no fact of outcome {outcome:?}; available: {}",
                    list_or_none(&available)
                ),
            ));
        }
    }
}

fn list_or_none(names: &[&str]) -> String {
    if names.is_empty() {
        "no placeholders".into()
    } else {
        names
            .iter()
            .map(|n| format!("{{{n}}}"))
            .collect::<Vec<_>>()
            .join(", ")
    }
}

/// Placeholders in phrasings: `{name}`.
fn phrasing_slots(p: &str) -> Result<Vec<String>, String> {
    let mut out = Vec::new();
    let mut rest = p;
    while let Some(open) = rest.find('{') {
        let Some(close) = rest[open..].find('}') else {
            return Err("'{' is not closed with '}'".into());
        };
        out.push(rest[open + 1..open + close].trim().to_string());
        rest = &rest[open + close + 1..];
    }
    if rest.contains('}') {
        return Err("'}' with no matching '{'".into());
    }
    Ok(out)
}

fn check_intent(
    file: &str,
    f: IntentFile,
    channels: &Channels,
    problems: &mut Vec<CatalogProblem>,
) -> Option<Intent> {
    let before = problems.len();
    let name = f.intent.value.trim().to_string();
    if name.is_empty()
        || !name
            .chars()
            .all(|c| c.is_ascii_lowercase() || c.is_ascii_digit() || c == '_')
    {
        problems.push(at(
            file,
            &f.intent,
            format!("intent name {name:?} must use lowercase letters, digits and '_'"),
        ));
    }
    let Some(op) = ops::find(&f.operation.value) else {
        problems.push(at(
            file,
            &f.operation,
            format!(
                "unknown operation {:?}; the operations are {}",
                f.operation.value,
                ops::names().join(", ")
            ),
        ));
        return None;
    };

    let mut slots = Vec::new();
    for (slot_name, spec) in &f.slots {
        let Some(kind) = EntityKind::from_name(&spec.value.entity.value) else {
            let kinds: Vec<&str> = EntityKind::ALL.iter().map(|k| k.name()).collect();
            problems.push(at(
                file,
                &spec.value.entity,
                format!(
                    "unknown entity kind {:?}; the kinds are {}",
                    spec.value.entity.value,
                    kinds.join(", ")
                ),
            ));
            continue;
        };
        let Some(param) = op.param(slot_name) else {
            let params: Vec<&str> = op.params.iter().map(|p| p.name).collect();
            problems.push(at(
                file,
                spec,
                format!(
                    "slot {slot_name:?} is not used by operation {}; it takes {}",
                    op.name,
                    if params.is_empty() {
                        "no slots".to_string()
                    } else {
                        params.join(", ")
                    }
                ),
            ));
            continue;
        };
        if param.kind != kind {
            problems.push(at(
                file,
                &spec.value.entity,
                format!(
                    "slot {slot_name:?} must hold a {} for operation {}, not a {}",
                    param.kind.name(),
                    op.name,
                    kind.name()
                ),
            ));
            continue;
        }
        let required = spec.value.required.unwrap_or(param.required);
        if param.required && !required {
            problems.push(at(
                file,
                spec,
                format!("slot {slot_name:?} is required by operation {}", op.name),
            ));
        }
        let ask = match (&spec.value.ask, required) {
            (Some(a), _) => a.clone(),
            (None, true) => {
                problems.push(at(file, spec, format!("required slot {slot_name:?} needs an `ask:` question for when it is missing")));
                String::new()
            }
            (None, false) => String::new(),
        };
        slots.push(SlotDef {
            name: slot_name.clone(),
            kind,
            required,
            ask,
        });
    }
    for p in op.params.iter().filter(|p| p.required) {
        if !f.slots.contains_key(p.name) {
            problems.push(at(
                file,
                &f.operation,
                format!(
                    "operation {} needs a slot {:?} of kind {}",
                    op.name,
                    p.name,
                    p.kind.name()
                ),
            ));
        }
    }

    let mut answers = Vec::new();
    match &f.answers {
        None => problems.push(at(
            file,
            &f.intent,
            format!(
                "an intent must say what it answers: `answers: [...]` with one or more of {}",
                Focus::ALL
                    .iter()
                    .map(|f| f.name())
                    .collect::<Vec<_>>()
                    .join(", ")
            ),
        )),
        Some(list) if list.value.is_empty() => {
            problems.push(at(file, list, "answers: name at least one focus".into()))
        }
        Some(list) => {
            for a in &list.value {
                match Focus::from_name(a.value.trim()) {
                    Some(x) if answers.contains(&x) => problems.push(at(
                        file,
                        a,
                        format!("answers: {:?} is listed twice", a.value),
                    )),
                    Some(x) => answers.push(x),
                    None => problems.push(at(
                        file,
                        a,
                        format!(
                            "answers: unknown focus {:?}; the focus names are {}",
                            a.value,
                            Focus::ALL
                                .iter()
                                .map(|f| f.name())
                                .collect::<Vec<_>>()
                                .join(", ")
                        ),
                    )),
                }
            }
        }
    }
    let mut honours = Vec::new();
    for h in &f.honours {
        let w = h.value.trim();
        if w == "negation" {
            honours.push(Honoured::Negation);
        } else if crate::understand::frame::EXTREMES.contains(&w) {
            honours.push(Honoured::Extreme(w.to_string()));
        } else {
            problems.push(at(
                file,
                h,
                format!(
                    "honours: {w:?} is neither `negation` nor a superlative ({})",
                    crate::understand::frame::EXTREMES.join(", ")
                ),
            ));
        }
    }
    if f.phrasings.is_empty() {
        problems.push(at(
            file,
            &f.intent,
            "an intent needs at least one phrasing".into(),
        ));
    }
    let declared: HashSet<&str> = f.slots.keys().map(String::as_str).collect();
    let mut phrasings = Vec::new();
    for p in &f.phrasings {
        match phrasing_slots(&p.value) {
            Err(m) => problems.push(at(file, p, m)),
            Ok(used) => {
                for u in used {
                    if !declared.contains(u.as_str()) {
                        problems.push(at(
                            file,
                            p,
                            format!("placeholder {{{u}}} has no slot; declare it under `slots:`"),
                        ));
                    }
                }
            }
        }
        phrasings.push(p.value.clone());
    }

    let mut replies = HashMap::new();
    for o in op.outcomes {
        if !f.replies.value.contains_key(o.name) {
            let all: Vec<&str> = op.outcomes.iter().map(|o| o.name).collect();
            problems.push(at(
                file,
                &f.replies,
                format!(
                    "replies need wording for outcome {:?} of operation {} (its outcomes: {})",
                    o.name,
                    op.name,
                    all.join(", ")
                ),
            ));
        }
    }
    for (outcome, text) in &f.replies.value {
        let Some(spec) = op.outcome(outcome) else {
            let all: Vec<&str> = op.outcomes.iter().map(|o| o.name).collect();
            problems.push(at(
                file,
                text,
                format!(
                    "operation {} has no outcome {outcome:?}; its outcomes are {}",
                    op.name,
                    all.join(", ")
                ),
            ));
            continue;
        };
        let Some(t) = template(file, text, problems) else {
            continue;
        };
        check_names(file, text, &t, outcome, &declared, spec.facts, problems);
        replies.insert(outcome.clone(), t);
    }
    let mut channel_replies: HashMap<String, HashMap<String, Template>> = HashMap::new();
    for (channel, wording) in &f.channel_replies {
        check_channel(
            file,
            "channel_replies",
            channel,
            wording,
            channels,
            problems,
        );
        for (outcome, text) in wording {
            let Some(spec) = op.outcome(outcome) else {
                problems.push(at(
                    file,
                    text,
                    format!(
                        "channel_replies: operation {} has no outcome {outcome:?}",
                        op.name
                    ),
                ));
                continue;
            };
            let Some(t) = template(file, text, problems) else {
                continue;
            };
            check_names(file, text, &t, outcome, &declared, spec.facts, problems);
            channel_replies
                .entry(channel.clone())
                .or_default()
                .insert(outcome.clone(), t);
        }
    }
    // A suggestion is a question offered as a quick reply; it may name the
    // intent's slots ("when was the {contest}?") and is left out when a
    // slot it names has no value.
    let mut suggestions = Vec::new();
    for s in &f.suggestions {
        let Some(t) = template(file, s, problems) else {
            continue;
        };
        for n in t.names() {
            if !declared.contains(n) {
                problems.push(at(
                    file,
                    s,
                    format!("placeholder {{{n}}} in a suggestion names no slot of this intent"),
                ));
            }
        }
        suggestions.push(t);
    }
    if problems.len() > before {
        return None;
    }
    Some(Intent {
        name,
        summary: f.summary,
        operation: op,
        answers,
        honours,
        phrasings,
        slots,
        replies,
        channel_replies,
        settings: f.settings,
        suggestions,
        file: file.to_string(),
    })
}
