//! The values an operation hands to the wording: names, numbers, marks,
//! times and lists of them. Each knows how it reads and how it sounds, so one
//! reply template serves text and voice channels alike.

use serde::{Deserialize, Serialize};

use super::words;

/// How a value is rendered.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Style {
    /// Written text: figures, symbols such as "s" and "m".
    Text,
    /// Words for a speech engine: no symbols, numbers spelled out.
    Spoken,
    /// Spoken words as an SSML fragment: text escaped for XML, ordinals,
    /// dates and times marked with `say-as`, pauses between list items.
    Ssml,
}

impl Style {
    /// Whether numbers and marks are said in words.
    pub fn is_spoken(self) -> bool {
        !matches!(self, Style::Text)
    }
}

/// Escapes text for XML 1.0 character data and attribute values (§2.4: `<`
/// and `&` must be escaped; `>`, `"` and `'` are escaped too so the text is
/// safe anywhere). A reader's text or a dataset name such as
/// `<break time="9s"/> & Co` is then spoken as text, never read as markup.
pub fn xml_escape(s: &str) -> String {
    let mut out = String::with_capacity(s.len());
    for c in s.chars() {
        match c {
            '&' => out.push_str("&amp;"),
            '<' => out.push_str("&lt;"),
            '>' => out.push_str("&gt;"),
            '"' => out.push_str("&quot;"),
            '\'' => out.push_str("&apos;"),
            // Characters XML 1.0 does not allow at all (§2.2) are dropped.
            c if (c as u32) < 0x20 && !matches!(c, '\t' | '\n' | '\r') => {}
            '\u{FFFE}' | '\u{FFFF}' => {}
            c => out.push(c),
        }
    }
    out
}

/// Written text a speech engine would read oddly, made speakable: brackets
/// become commas, quotes go, "&" is "and", a slash a space. Letters and
/// digits are kept.
pub fn speakable(s: &str) -> String {
    let mut out = String::with_capacity(s.len());
    for c in s.chars() {
        match c {
            '(' | '[' => out.push_str(", "),
            ')' | ']' => out.push(','),
            '\u{201C}' | '\u{201D}' | '"' | '*' | '_' | '#' | '|' | '~' | '^' => {}
            '&' => out.push_str(" and "),
            '/' | '\\' => out.push(' '),
            '\u{2013}' | '\u{2014}' => out.push_str(", "),
            '\u{2026}' => out.push('.'),
            c => out.push(c),
        }
    }
    // Brackets turned to commas can leave ", ," or ",." behind, and quotes
    // taken away "?." ("… on tomorrow?”.").
    let mut tidy = String::with_capacity(out.len());
    for c in out.chars() {
        if c == '.' && (tidy.ends_with('?') || tidy.ends_with('!')) {
            continue;
        }
        if matches!(c, ',' | '.' | '?' | '!' | ';' | ':') {
            while tidy.ends_with(' ') {
                tidy.pop();
            }
            if tidy.ends_with(',') {
                tidy.pop();
            }
        }
        if c == ' ' && tidy.ends_with(' ') {
            continue;
        }
        tidy.push(c);
    }
    tidy
}

/// One value an operation produced.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(untagged)]
pub enum Value {
    /// Running text, printed as is.
    Text(String),
    /// A name that takes a plural verb ("Moorland Progressives have"), as
    /// the data say of some groups; otherwise like `Text`.
    Plural(String),
    /// A whole number; in running text one to nine are written as words.
    Int(i64),
    /// A value with a written form, a spoken form and an SSML form (an
    /// ordinal, a time or a date marked with `say-as`). The SSML form is
    /// built by the service from escaped parts, never from raw input.
    Said {
        text: String,
        spoken: String,
        ssml: String,
    },
    /// A value with a written and a spoken form (marks, times, dates).
    Dual { text: String, spoken: String },
    /// Several values, joined by a list filter.
    List(Vec<Value>),
}

impl Value {
    /// Whether an optional section that uses this value should be shown:
    /// empty text, an empty list and zero count as absent.
    pub fn is_present(&self) -> bool {
        match self {
            Value::Text(s) | Value::Plural(s) => !s.is_empty(),
            Value::Int(n) => *n != 0,
            Value::Dual { text, .. } | Value::Said { text, .. } => !text.is_empty(),
            Value::List(v) => !v.is_empty(),
        }
    }

    /// How many things the value stands for, for agreement ("was"/"were").
    pub fn count(&self) -> i64 {
        match self {
            Value::Int(n) => *n,
            Value::List(v) => v.len() as i64,
            Value::Plural(_) => 2,
            _ => 1,
        }
    }

    /// Renders the value on its own, lists joined with "and".
    pub fn render(&self, style: Style) -> String {
        self.render_joined(style, "and")
    }

    /// Renders the value, a list joined with `conj` ("and", "or"). In SSML
    /// a short pause follows each item but the last, so a list of names
    /// is not run together.
    pub fn render_joined(&self, style: Style, conj: &str) -> String {
        match (self, style) {
            (Value::Text(s) | Value::Plural(s), Style::Text) => s.clone(),
            (Value::Text(s) | Value::Plural(s), Style::Spoken) => words::speak_numbers(s),
            (Value::Text(s) | Value::Plural(s), Style::Ssml) => {
                xml_escape(&speakable(&words::speak_numbers(s)))
            }
            (Value::Int(n), Style::Ssml) => xml_escape(&int_words(*n, style, false)),
            (Value::Int(n), _) => int_words(*n, style, false),
            (Value::Dual { text, .. } | Value::Said { text, .. }, Style::Text) => text.clone(),
            (Value::Dual { spoken, .. } | Value::Said { spoken, .. }, Style::Spoken) => {
                words::speak_numbers(spoken)
            }
            (Value::Dual { spoken, .. }, Style::Ssml) => {
                xml_escape(&speakable(&words::speak_numbers(spoken)))
            }
            (Value::Said { ssml, .. }, Style::Ssml) => ssml.clone(),
            (Value::List(items), Style::Ssml) => {
                let n = items.len();
                let parts: Vec<String> = items
                    .iter()
                    .enumerate()
                    .map(|(i, v)| {
                        let s = v.render(style);
                        if i + 1 < n {
                            format!("{s}{LIST_PAUSE}")
                        } else {
                            s
                        }
                    })
                    .collect();
                words::join_list(&parts, conj)
            }
            (Value::List(items), _) => {
                let parts: Vec<String> = items.iter().map(|v| v.render(style)).collect();
                words::join_list(&parts, conj)
            }
        }
    }

    /// This value, `sep`, then `next`, as one value in every form: "2nd" +
    /// " in the " + "men's 100 m" reads "2nd in the men's 100 m", is said
    /// "second in the men's one hundred metres", and keeps the ordinal's
    /// markup in SSML.
    pub fn then(&self, sep: &str, next: &Value) -> Value {
        let both = |style: Style| {
            let sep = match style {
                Style::Ssml => xml_escape(sep),
                _ => sep.to_string(),
            };
            format!("{}{sep}{}", self.render(style), next.render(style))
        };
        Value::Said {
            text: both(Style::Text),
            spoken: both(Style::Spoken),
            ssml: both(Style::Ssml),
        }
    }

    /// An ordinal place: "2nd", "second", `<say-as interpret-as="ordinal">`.
    pub fn ordinal(n: u64) -> Value {
        Value::ordinal_with(n, "")
    }

    /// An ordinal with a prefix word: "joint 2nd".
    pub fn ordinal_with(n: u64, prefix: &str) -> Value {
        let p = if prefix.is_empty() {
            String::new()
        } else {
            format!("{prefix} ")
        };
        Value::Said {
            text: format!("{p}{}", words::ordinal_figure(n)),
            spoken: format!("{p}{}", words::ordinal(n)),
            // Value from the W3C Note "SSML 1.0 say-as attribute values";
            // the content is written "2nd", which an engine without
            // say-as support still reads "second" (espeak-ng does), where
            // a bare "2" would be read "two".
            ssml: format!(
                "{}<say-as interpret-as=\"ordinal\">{}</say-as>",
                xml_escape(&p),
                words::ordinal_figure(n)
            ),
        }
    }
}

/// Named values from pairs, for tests of wording.
#[cfg(test)]
pub(crate) fn values_of(pairs: &[(&str, Value)]) -> std::collections::HashMap<String, Value> {
    pairs
        .iter()
        .map(|(k, v)| (k.to_string(), v.clone()))
        .collect()
}

/// The pause after each item of a spoken list.
pub const LIST_PAUSE: &str = "<break time=\"200ms\"/>";

/// A whole number for running text: words from one to nine (common
/// newsroom practice), figures above, and always words when spoken.
pub fn int_words(n: i64, style: Style, figures: bool) -> String {
    let neg = if n < 0 { "minus " } else { "" };
    let abs = n.unsigned_abs();
    match (style, figures) {
        (Style::Spoken | Style::Ssml, _) => format!("{neg}{}", words::cardinal(abs)),
        (Style::Text, true) => format!("{neg}{}", words::figures(abs)),
        (Style::Text, false) if abs >= 10 => format!("{neg}{}", words::figures(abs)),
        (Style::Text, false) => format!("{neg}{}", words::running_number(abs)),
    }
}

impl From<&str> for Value {
    fn from(s: &str) -> Self {
        Value::Text(s.to_string())
    }
}

impl From<String> for Value {
    fn from(s: String) -> Self {
        Value::Text(s)
    }
}

impl From<i64> for Value {
    fn from(n: i64) -> Self {
        Value::Int(n)
    }
}

impl From<Vec<String>> for Value {
    fn from(v: Vec<String>) -> Self {
        Value::List(v.into_iter().map(Value::Text).collect())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn running_numbers_are_words_up_to_nine() {
        assert_eq!(Value::Int(3).render(Style::Text), "three");
        assert_eq!(Value::Int(12).render(Style::Text), "12");
        assert_eq!(Value::Int(1234).render(Style::Text), "1,234");
        assert_eq!(Value::Int(12).render(Style::Spoken), "twelve");
    }

    #[test]
    fn lists_join_with_and() {
        let v: Value = vec!["A".to_string(), "B".to_string(), "C".to_string()].into();
        assert_eq!(v.render(Style::Text), "A, B and C");
        assert_eq!(v.count(), 3);
    }

    #[test]
    fn thousands_are_grouped() {
        assert_eq!(words::figures(0), "0");
        assert_eq!(words::figures(999), "999");
        assert_eq!(words::figures(1000), "1,000");
        assert_eq!(words::figures(1234567), "1,234,567");
    }
}
