//! The realiser: from a reply's wording and values to what a channel
//! shows or says.
//!
//! The same wording gives every channel its text. Agreement, plurals, list
//! joining, ordinals and numbers come from the values and the template
//! filters; this module chooses the style (written or spoken), makes the
//! text fit the channel by choosing shorter wording — dropping optional
//! parts from the last written, then asides in brackets, then whole
//! trailing sentences — and never by cutting a word or a number, and builds
//! the SSML document and the lightly emphasised copy where the profile asks.

use std::collections::HashMap;

use super::channel::Profile;
use super::value::{xml_escape, Style, Value};
use super::{sms, ssml, words};
use crate::catalog::Template;

/// A reply as the channel gets it.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct Realised {
    /// The text: written or spoken words, fitted to the channel.
    pub text: String,
    /// The SSML 1.1 document, for channels that speak.
    pub ssml: Option<String>,
    /// The text with light emphasis (Markdown bold on names and marks).
    pub markdown: Option<String>,
}

/// Which wording was chosen for a channel, so the text, the SSML and the
/// emphasised copy all say the same thing.
#[derive(Debug, Clone, Copy)]
struct Choice {
    /// How many optional parts are kept.
    keep: usize,
    /// Whether the freshness sentence is kept.
    fresh: bool,
    /// Whether the profile's shorter forms are used.
    short: bool,
}

/// Realises wording with its values; `freshness` is a closing sentence
/// ("As of 21:04.") for profiles that cite it, dropped first when room is
/// short.
pub fn realise(
    profile: &Profile,
    template: &Template,
    values: &HashMap<String, Value>,
    freshness: Option<&Template>,
) -> Realised {
    // Wording that already says when ("as of 21:02") needs no second time.
    let freshness = freshness.filter(|_| {
        profile.freshness
            && !template
                .render(values, Style::Text)
                .to_lowercase()
                .contains("as of ")
    });
    let shortest = Choice {
        keep: 0,
        fresh: false,
        short: true,
    };
    // A wording that fits, else the shortest wording without its asides in
    // brackets ("1. Kalvenmark, 2. Brellmoor and 2. Quessary" without their
    // medal counts), where every item is still there.
    let attempt = |values: &HashMap<String, Value>| {
        realise_fitting(profile, template, values, freshness).or_else(|| {
            let no_asides = for_channel(
                profile,
                &drop_asides(&render_text(profile, template, values, freshness, shortest)),
            );
            (!no_asides.trim().is_empty() && profile.fits(&no_asides))
                .then(|| from_text(profile, no_asides))
        })
    };
    if let Some(r) = attempt(values) {
        return r;
    }
    // Nothing fits with every item of the longest list: keep its first
    // items and say how many more there are ("… and 8 more"), fewer and
    // fewer until it fits. A list is never cut inside an item.
    if let Some((name, items)) = values
        .iter()
        .filter_map(|(k, v)| match v {
            Value::List(items) if items.len() > 1 => Some((k.clone(), items.clone())),
            _ => None,
        })
        .max_by_key(|(k, items)| (items.len(), std::cmp::Reverse(k.clone())))
    {
        for k in (1..items.len()).rev() {
            let mut fewer = values.clone();
            let mut head: Vec<Value> = items[..k].to_vec();
            head.push(Value::Text(format!("{} more", items.len() - k)));
            fewer.insert(name.clone(), Value::List(head));
            if let Some(r) = attempt(&fewer) {
                return r;
            }
        }
    }
    // Last resort: trailing sentences of the shortest wording without its
    // asides go (that wording itself was tried above).
    let no_asides = for_channel(
        profile,
        &drop_asides(&render_text(profile, template, values, freshness, shortest)),
    );
    from_text(profile, leading_sentences(profile, no_asides))
}

/// A reply made from its final text alone, when the wording had to be
/// shortened as text: speech then says exactly the text, and the
/// emphasised copy is the text.
fn from_text(profile: &Profile, text: String) -> Realised {
    Realised {
        ssml: profile
            .ssml
            .then(|| ssml::document(&profile.language, &[xml_escape(&text)])),
        markdown: profile.emphasis.then(|| super::channel::markdown(&text)),
        text,
    }
}

/// The longest wording that fits, trying in order: everything; without the
/// freshness sentence; then for each number of optional parts (dropping
/// the last written first), as written and with the shorter forms.
fn realise_fitting(
    profile: &Profile,
    template: &Template,
    values: &HashMap<String, Value>,
    freshness: Option<&Template>,
) -> Option<Realised> {
    let n = template.optional_parts();
    let choices = std::iter::once(Choice {
        keep: n,
        fresh: true,
        short: false,
    })
    .chain((0..=n).rev().flat_map(|keep| {
        [false, true].map(|short| Choice {
            keep,
            fresh: false,
            short,
        })
    }));
    for c in choices {
        if c.fresh && freshness.is_none() {
            continue;
        }
        let text = render_text(profile, template, values, freshness, c);
        // Wording made only of optional parts can drop to nothing, which
        // "fits" every channel but says nothing: never an answer.
        if text.trim().is_empty() || !profile.fits(&text) {
            continue;
        }
        let ssml = profile.ssml.then(|| {
            let mut sentences = vec![finish(
                template.render_keeping(values, Style::Ssml, c.keep),
                Style::Ssml,
            )];
            if let (true, Some(f)) = (c.fresh, freshness) {
                sentences.push(finish(f.render(values, Style::Ssml), Style::Ssml));
            }
            ssml::document(&profile.language, &sentences)
        });
        let markdown = profile.emphasis.then(|| {
            let bold = emphasised(values);
            super::channel::markdown(&render_text(profile, template, &bold, freshness, c))
        });
        return Some(Realised {
            text,
            ssml,
            markdown,
        });
    }
    None
}

/// The channel's text for one choice of wording.
fn render_text(
    profile: &Profile,
    template: &Template,
    values: &HashMap<String, Value>,
    freshness: Option<&Template>,
    c: Choice,
) -> String {
    let style = profile.style();
    let mut out = finish(template.render_keeping(values, style, c.keep), style);
    if let (true, Some(f)) = (c.fresh, freshness) {
        out.push(' ');
        out.push_str(&finish(f.render(values, style), style));
    }
    let out = for_channel(profile, &out);
    if c.short {
        profile.shortened(&out)
    } else {
        out
    }
}

/// Realises text that has no template (a question the intent asks).
pub fn realise_text(profile: &Profile, text: &str) -> Realised {
    let t = Template::parse(&text.replace(['{', '}', '[', ']'], ""))
        .unwrap_or_else(|_| Template::parse("").expect("empty wording parses"));
    realise(profile, &t, &HashMap::new(), None)
}

/// Capital first letter and a closing full stop. SSML's first character may
/// be markup, which capitalising leaves alone.
fn finish(text: String, style: Style) -> String {
    let t = words::ensure_period(&text);
    match style {
        Style::Ssml => t,
        _ => words::capitalize_first(&t),
    }
}

/// What the channel's text needs besides fitting: plain typography for an
/// SMS (curly quotes would force UCS-2 and halve the room), speakable
/// symbols for spoken text.
fn for_channel(profile: &Profile, text: &str) -> String {
    let t = if profile.one_sms_segment {
        sms::plain_typography(text)
    } else {
        text.to_string()
    };
    if profile.spoken {
        words::capitalize_first(super::value::speakable(&t).trim())
    } else {
        t
    }
}

/// The most leading whole sentences of `text` that fit; `text` itself,
/// even if it does not fit, rather than a cut word.
fn leading_sentences(profile: &Profile, text: String) -> String {
    let sentences = split_sentences(&text);
    for n in (1..sentences.len()).rev() {
        let t = sentences[..n].join(" ");
        if profile.fits(&t) {
            return t;
        }
    }
    tracing::warn!(channel = %profile.name, "no wording fits the channel");
    text
}

/// Removes " (…)" asides: "Zoë Quillon (Quessary)" → "Zoë Quillon".
fn drop_asides(text: &str) -> String {
    let mut out = String::with_capacity(text.len());
    let mut depth = 0usize;
    for c in text.chars() {
        match c {
            '(' => {
                depth += 1;
                while out.ends_with(' ') {
                    out.pop();
                }
            }
            ')' if depth > 0 => depth -= 1,
            _ if depth > 0 => {}
            c => out.push(c),
        }
    }
    out
}

/// Sentences, each with its closing punctuation. A sentence ends at ".",
/// "!" or "?" followed by a space and a capital letter, except the full
/// stop of a list number ("Medal table: 1. Kalvenmark, 2. Brellmoor"): a
/// number that opens the text or follows ": " or ", ".
fn split_sentences(text: &str) -> Vec<String> {
    let mut out = Vec::new();
    let mut cur = String::new();
    let chars: Vec<char> = text.chars().collect();
    for (i, &c) in chars.iter().enumerate() {
        cur.push(c);
        let list_number = {
            let mut j = i;
            while j > 0 && chars[j - 1].is_ascii_digit() {
                j -= 1;
            }
            j < i
                && (j == 0 || (j >= 2 && chars[j - 1] == ' ' && matches!(chars[j - 2], ',' | ':')))
        };
        let next_starts =
            chars.get(i + 1) == Some(&' ') && chars.get(i + 2).is_some_and(|n| n.is_uppercase());
        let end = matches!(c, '.' | '!' | '?') && !(c == '.' && list_number) && next_starts;
        if end {
            out.push(cur.trim().to_string());
            cur.clear();
        }
    }
    if !cur.trim().is_empty() {
        out.push(cur.trim().to_string());
    }
    out
}

/// Names and marks in bold for the emphasised copy: list items (people,
/// teams) and values with a spoken form (marks, times, places).
fn emphasised(values: &HashMap<String, Value>) -> HashMap<String, Value> {
    use super::channel::{EMPHASIS_CLOSE as C, EMPHASIS_OPEN as O};
    // Marks, not `**`: the whole text is escaped for Markdown afterwards
    // and the marks become `**` then (channel::markdown).
    fn wrap(t: &str) -> String {
        format!("{O}{}{C}", t.replace([O, C], ""))
    }
    fn bold(v: &Value) -> Value {
        match v {
            Value::List(items) => Value::List(items.iter().map(bold).collect()),
            Value::Dual { text, spoken } => Value::Dual {
                text: wrap(text),
                spoken: spoken.clone(),
            },
            Value::Said { text, spoken, ssml } => Value::Said {
                text: wrap(text),
                spoken: spoken.clone(),
                ssml: ssml.clone(),
            },
            Value::Text(t) => Value::Text(wrap(t)),
            Value::Plural(t) => Value::Plural(wrap(t)),
            other => other.clone(),
        }
    }
    // Only names with their team, marks, places and times: plain text
    // lists (help topics) stay as they are, so the emphasis stays light.
    fn marked(v: &Value) -> bool {
        match v {
            Value::Dual { .. } | Value::Said { .. } => true,
            Value::List(items) => items.iter().any(marked),
            _ => false,
        }
    }
    values
        .iter()
        .map(|(k, v)| {
            let v = if marked(v) { bold(v) } else { v.clone() };
            (k.clone(), v)
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::answers::channel::Channels;

    use crate::answers::value::values_of as vals;

    #[test]
    fn an_sms_drops_optional_parts_before_anything_else() {
        let c = Channels::built_in();
        let t = Template::parse(
            "{winner} won the {contest}[, with {silver} second][ and {bronze} third].",
        )
        .unwrap();
        let v = vals(&[
            ("winner", "Pevelle Cosevmont (Vastrelia)".into()),
            ("contest", "women's 100 m freestyle".into()),
            ("silver", "Zoë Quillon (Quessary)".into()),
            ("bronze", "Ramelle Gulkmont (Halvorne)".into()),
        ]);
        let chat = realise(c.get("chat").unwrap(), &t, &v, None);
        assert!(chat
            .text
            .ends_with("and Ramelle Gulkmont (Halvorne) third."));
        let sms = realise(c.get("sms").unwrap(), &t, &v, None);
        // "Zoë" needs UCS-2 (70 units): the silver and bronze clauses go,
        // the winner stays whole.
        assert_eq!(
            sms.text,
            "Pevelle Cosevmont (Vastrelia) won the women's 100 m freestyle."
        );
        assert!(sms::measure(&sms.text).fits_one_segment());
    }

    #[test]
    fn wording_of_optional_parts_only_never_fits_as_nothing() {
        let c = Channels::built_in();
        let t = Template::parse("[Counting: {live|and}. ][Not started: {later|and}.]").unwrap();
        let many: Vec<Value> = (1..=12)
            .map(|i| Value::Text(format!("Ward number {i} (50% counted)")))
            .collect();
        let v = vals(&[
            ("live", Value::List(many)),
            ("later", Value::List(vec!["Quellan Cross".into()])),
        ]);
        let sms = realise(c.get("sms").unwrap(), &t, &v, None);
        assert!(
            sms.text.starts_with("Counting: Ward number 1"),
            "{}",
            sms.text
        );
        assert!(sms.text.contains("more"), "{}", sms.text);
        assert!(sms::measure(&sms.text).fits_one_segment());
    }

    #[test]
    fn asides_and_trailing_sentences_go_last() {
        assert_eq!(
            drop_asides("Zoë Quillon (swimmer, Quessary) or Zoë Marrant (rower)?"),
            "Zoë Quillon or Zoë Marrant?"
        );
        assert_eq!(
            split_sentences("One. Two 2.5 m! Three?"),
            vec!["One.", "Two 2.5 m!", "Three?"]
        );
        // A numbered list is one sentence; a number ending one is not a
        // list number.
        assert_eq!(
            split_sentences("Table: 1. Kalvenmark, 2. Brellmoor. Next."),
            vec!["Table: 1. Kalvenmark, 2. Brellmoor.", "Next."]
        );
        assert_eq!(
            split_sentences("A won heat 1. No medals."),
            vec!["A won heat 1.", "No medals."]
        );
    }

    #[test]
    fn voice_gets_spoken_words_and_a_document() {
        let c = Channels::built_in();
        let t = Template::parse("{who} finished {place}.").unwrap();
        let v = vals(&[
            ("who", "Zoë Quillon (Quessary)".into()),
            ("place", Value::ordinal(2)),
        ]);
        let r = realise(c.get("voice").unwrap(), &t, &v, None);
        assert_eq!(r.text, "Zoë Quillon, Quessary, finished second.");
        let doc = r.ssml.unwrap();
        assert!(
            doc.contains("<say-as interpret-as=\"ordinal\">2nd</say-as>"),
            "{doc}"
        );
        assert!(doc.starts_with("<?xml version=\"1.0\" encoding=\"UTF-8\"?><speak version=\"1.1\""));
    }
}
