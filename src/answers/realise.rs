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
use super::value::{Style, Value};
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

/// Realises wording with its values; `freshness` is a closing sentence
/// ("As of 21:04.") for profiles that cite it, dropped first when room is
/// short.
pub fn realise(
    profile: &Profile,
    template: &Template,
    values: &HashMap<String, Value>,
    freshness: Option<&Template>,
) -> Realised {
    let style = profile.style();
    // Wording that already says when ("as of 21:02") needs no second time.
    let freshness = freshness.filter(|_| {
        profile.freshness
            && !template
                .render(values, Style::Text)
                .to_lowercase()
                .contains("as of ")
    });
    let with_fresh = |keep: usize, fresh: bool, style: Style| {
        let mut out = finish(template.render_keeping(values, style, keep), style);
        if let (true, Some(f)) = (fresh, freshness) {
            out.push(' ');
            out.push_str(&finish(f.render(values, style), style));
        }
        out
    };
    // The longest wording that fits: everything, then without the
    // freshness sentence, then with the channel's shorter forms, then with
    // fewer optional parts.
    let n = template.optional_parts();
    let choices = std::iter::once((n, true, false)).chain(
        (0..=n)
            .rev()
            .flat_map(|k| [(k, false, false), (k, false, true)]),
    );
    let mut chosen = None;
    for (keep, fresh, short) in choices {
        let mut text = for_channel(profile, &with_fresh(keep, fresh, style));
        if short {
            text = profile.shortened(&text);
        }
        if profile.fits(&text) {
            chosen = Some((keep, fresh, text));
            break;
        }
    }
    let (keep, fresh, text) = match chosen {
        Some(c) => c,
        None => (
            0,
            false,
            shorten(profile, &profile.shortened(&with_fresh(0, false, style))),
        ),
    };
    let ssml = profile.ssml.then(|| {
        let body = finish(
            template.render_keeping(values, Style::Ssml, keep),
            Style::Ssml,
        );
        let mut sentences = vec![body];
        if let (true, Some(f)) = (fresh, freshness) {
            sentences.push(finish(f.render(values, Style::Ssml), Style::Ssml));
        }
        ssml::document(&profile.language, &sentences)
    });
    let markdown = profile.emphasis.then(|| {
        let bold = emphasised(values);
        for_channel(profile, &with_fresh_values(template, &bold, keep, style))
    });
    Realised {
        text,
        ssml,
        markdown,
    }
}

/// Realises text that has no template (a question the intent asks).
pub fn realise_text(profile: &Profile, text: &str) -> Realised {
    let t = Template::parse(&text.replace(['{', '}', '[', ']'], ""))
        .unwrap_or_else(|_| Template::parse("").expect("empty wording parses"));
    realise(profile, &t, &HashMap::new(), None)
}

fn with_fresh_values(
    template: &Template,
    values: &HashMap<String, Value>,
    keep: usize,
    style: Style,
) -> String {
    finish(template.render_keeping(values, style, keep), style)
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

/// Last resorts when no wording fits: leave out asides in brackets, then
/// keep only the leading whole sentences that fit. The shortest of these is
/// returned even if it does not fit, rather than a cut word.
fn shorten(profile: &Profile, text: &str) -> String {
    let no_asides = for_channel(profile, &drop_asides(text));
    if profile.fits(&no_asides) {
        return no_asides;
    }
    let sentences = split_sentences(&no_asides);
    for n in (1..sentences.len()).rev() {
        let t = sentences[..n].join(" ");
        if profile.fits(&t) {
            return t;
        }
    }
    tracing::warn!(channel = %profile.name, "no wording fits the channel");
    no_asides
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

/// Sentences, each with its closing punctuation.
fn split_sentences(text: &str) -> Vec<String> {
    let mut out = Vec::new();
    let mut cur = String::new();
    let chars: Vec<char> = text.chars().collect();
    for (i, &c) in chars.iter().enumerate() {
        cur.push(c);
        let end = matches!(c, '.' | '!' | '?') && chars.get(i + 1).is_none_or(|n| *n == ' ');
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
    fn bold(v: &Value) -> Value {
        match v {
            Value::List(items) => Value::List(items.iter().map(bold).collect()),
            Value::Dual { text, spoken } => Value::Dual {
                text: format!("**{text}**"),
                spoken: spoken.clone(),
            },
            Value::Said { text, spoken, ssml } => Value::Said {
                text: format!("**{text}**"),
                spoken: spoken.clone(),
                ssml: ssml.clone(),
            },
            Value::Text(t) => Value::Text(format!("**{t}**")),
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

    fn vals(pairs: &[(&str, Value)]) -> HashMap<String, Value> {
        pairs
            .iter()
            .map(|(k, v)| (k.to_string(), v.clone()))
            .collect()
    }

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
    fn asides_and_trailing_sentences_go_last() {
        assert_eq!(
            drop_asides("Zoë Quillon (swimmer, Quessary) or Zoë Marrant (rower)?"),
            "Zoë Quillon or Zoë Marrant?"
        );
        assert_eq!(
            split_sentences("One. Two 2.5 m! Three?"),
            vec!["One.", "Two 2.5 m!", "Three?"]
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
            doc.contains("<say-as interpret-as=\"ordinal\">2</say-as>"),
            "{doc}"
        );
        assert!(doc.starts_with("<?xml version=\"1.0\" encoding=\"UTF-8\"?><speak version=\"1.1\""));
    }
}
