//! Reply wording: the small template language editors write in intents.
//!
//! `{name}` inserts a slot or a fact; `{name|filter}` shapes it; `[...]` is an
//! optional part, left out when any value it uses is absent, empty or zero.
//! Filters (see `docs/intents.md`):
//! `and`, `or` (list joining), `count:noun` or `count:noun:plural`
//! ("three medals"), `ordinal` ("third"), `nth` ("3rd"), `figure` (digits),
//! `verb:is:are` (agreement with the value's count), `upper`, `lower`.
//! The first letter of a reply is capitalised.

use std::collections::HashMap;
use std::fmt;

use crate::answers::value::{int_words, speakable, xml_escape, Style, Value};
use crate::answers::words;

/// A parsed template.
#[derive(Debug, Clone, PartialEq)]
pub struct Template {
    pieces: Vec<Piece>,
    source: String,
}

#[derive(Debug, Clone, PartialEq)]
enum Piece {
    Literal(String),
    Field { name: String, filters: Vec<Filter> },
    Optional(Vec<Piece>),
}

#[derive(Debug, Clone, PartialEq)]
enum Filter {
    Join(&'static str),
    Count {
        singular: String,
        plural: Option<String>,
    },
    Ordinal,
    Nth,
    Figure,
    Verb {
        one: String,
        many: String,
    },
    Upper,
    Lower,
    /// "a swimmer", "an athlete".
    Article,
}

/// A mistake in a template, at a character offset within it.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct TemplateError {
    /// Zero-based character offset in the template text.
    pub offset: usize,
    pub message: String,
}

impl fmt::Display for TemplateError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(&self.message)
    }
}

impl Template {
    /// Parses wording; fails on unbalanced brackets and unknown filters.
    pub fn parse(source: &str) -> Result<Template, TemplateError> {
        let chars: Vec<char> = source.chars().collect();
        let mut pos = 0;
        let pieces = parse_seq(&chars, &mut pos, false)?;
        if pos < chars.len() {
            return Err(TemplateError {
                offset: pos,
                message: "unexpected ']' with no matching '['".into(),
            });
        }
        Ok(Template {
            pieces,
            source: source.to_string(),
        })
    }

    /// The wording as the editor wrote it.
    pub fn source(&self) -> &str {
        &self.source
    }

    /// Every name the template uses, in order of appearance.
    pub fn names(&self) -> Vec<&str> {
        fn walk<'a>(pieces: &'a [Piece], out: &mut Vec<&'a str>) {
            for p in pieces {
                match p {
                    Piece::Field { name, .. } => out.push(name),
                    Piece::Optional(inner) => walk(inner, out),
                    Piece::Literal(_) => {}
                }
            }
        }
        let mut out = Vec::new();
        walk(&self.pieces, &mut out);
        out
    }

    /// Renders with the given values. A name with no value renders as empty
    /// text outside optional parts; the catalog check makes sure every name
    /// is one the operation can supply.
    pub fn render(&self, values: &HashMap<String, Value>, style: Style) -> String {
        self.render_keeping(values, style, usize::MAX)
    }

    /// Renders keeping only the first `keep` optional parts (in the order
    /// they are written; later ones are taken to matter less), so a channel
    /// with little room can choose shorter wording instead of cutting text.
    pub fn render_keeping(
        &self,
        values: &HashMap<String, Value>,
        style: Style,
        keep: usize,
    ) -> String {
        let mut out = String::new();
        let mut seen = 0;
        render_seq(&self.pieces, values, style, keep, &mut seen, &mut out);
        let out = tidy_spaces(&out);
        words::capitalize_first(&out)
    }

    /// How many optional parts the template has, nested ones included.
    pub fn optional_parts(&self) -> usize {
        count_optional(&self.pieces)
    }

    /// The longest rendering that `fits`: all optional parts first, then
    /// dropping them from the last one written. `None` when even the
    /// shortest does not fit.
    pub fn render_fitting(
        &self,
        values: &HashMap<String, Value>,
        style: Style,
        fits: &dyn Fn(&str) -> bool,
    ) -> Option<String> {
        (0..=self.optional_parts())
            .rev()
            .map(|keep| self.render_keeping(values, style, keep))
            .find(|t| fits(t))
    }
}

fn parse_seq(chars: &[char], pos: &mut usize, nested: bool) -> Result<Vec<Piece>, TemplateError> {
    let mut pieces = Vec::new();
    let mut lit = String::new();
    while *pos < chars.len() {
        let c = chars[*pos];
        match c {
            '{' => {
                if !lit.is_empty() {
                    pieces.push(Piece::Literal(std::mem::take(&mut lit)));
                }
                let start = *pos;
                let close = chars[start..]
                    .iter()
                    .position(|&c| c == '}')
                    .map(|i| start + i);
                let Some(close) = close else {
                    return Err(TemplateError {
                        offset: start,
                        message: "'{' is not closed with '}'".into(),
                    });
                };
                let inner: String = chars[start + 1..close].iter().collect();
                pieces.push(parse_field(&inner, start)?);
                *pos = close + 1;
            }
            '}' => {
                return Err(TemplateError {
                    offset: *pos,
                    message: "'}' with no matching '{'".into(),
                })
            }
            '[' => {
                if !lit.is_empty() {
                    pieces.push(Piece::Literal(std::mem::take(&mut lit)));
                }
                let start = *pos;
                *pos += 1;
                let inner = parse_seq(chars, pos, true)?;
                if *pos >= chars.len() || chars[*pos] != ']' {
                    return Err(TemplateError {
                        offset: start,
                        message: "'[' is not closed with ']'".into(),
                    });
                }
                *pos += 1;
                pieces.push(Piece::Optional(inner));
            }
            ']' if nested => break,
            ']' => {
                return Err(TemplateError {
                    offset: *pos,
                    message: "']' with no matching '['".into(),
                })
            }
            _ => {
                lit.push(c);
                *pos += 1;
            }
        }
    }
    if !lit.is_empty() {
        pieces.push(Piece::Literal(lit));
    }
    Ok(pieces)
}

fn parse_field(inner: &str, offset: usize) -> Result<Piece, TemplateError> {
    let mut parts = inner.split('|');
    let name = parts.next().unwrap_or("").trim().to_string();
    if name.is_empty() || !name.chars().all(|c| c.is_ascii_alphanumeric() || c == '_') {
        return Err(TemplateError {
            offset,
            message: format!(
                "{{{inner}}} is not a placeholder: use a name made of letters, digits and '_'"
            ),
        });
    }
    let mut filters = Vec::new();
    for f in parts {
        let args: Vec<&str> = f.trim().split(':').collect();
        let filter = match args.as_slice() {
            ["and"] | ["list"] => Filter::Join("and"),
            ["or"] => Filter::Join("or"),
            ["count", one] => Filter::Count { singular: one.to_string(), plural: None },
            ["count", one, many] => Filter::Count { singular: one.to_string(), plural: Some(many.to_string()) },
            ["ordinal"] => Filter::Ordinal,
            ["nth"] => Filter::Nth,
            ["figure"] => Filter::Figure,
            ["verb", one, many] => Filter::Verb { one: one.to_string(), many: many.to_string() },
            ["upper"] => Filter::Upper,
            ["lower"] => Filter::Lower,
            ["a"] => Filter::Article,
            _ => {
                return Err(TemplateError {
                    offset,
                    message: format!(
                        "unknown filter {:?} in {{{inner}}}; filters are and, or, count:noun, ordinal, nth, figure, verb:one:many, upper, lower, a",
                        f.trim()
                    ),
                })
            }
        };
        filters.push(filter);
    }
    Ok(Piece::Field { name, filters })
}

/// How many optional parts `pieces` hold, nested ones included.
fn count_optional(pieces: &[Piece]) -> usize {
    pieces
        .iter()
        .map(|p| match p {
            Piece::Optional(inner) => 1 + count_optional(inner),
            _ => 0,
        })
        .sum()
}

fn all_present(pieces: &[Piece], values: &HashMap<String, Value>) -> bool {
    pieces.iter().all(|p| match p {
        Piece::Field { name, .. } => values.get(name).is_some_and(Value::is_present),
        // A nested optional part decides for itself.
        Piece::Optional(_) | Piece::Literal(_) => true,
    })
}

fn render_seq(
    pieces: &[Piece],
    values: &HashMap<String, Value>,
    style: Style,
    keep: usize,
    seen: &mut usize,
    out: &mut String,
) {
    for p in pieces {
        match p {
            Piece::Literal(s) if style == Style::Ssml => {
                out.push_str(&xml_escape(&speakable(&words::speak_numbers(s))))
            }
            Piece::Literal(s) if style == Style::Spoken => out.push_str(&words::speak_numbers(s)),
            Piece::Literal(s) => out.push_str(s),
            Piece::Optional(inner) => {
                let index = *seen;
                *seen += 1;
                if index < keep && all_present(inner, values) {
                    render_seq(inner, values, style, keep, seen, out);
                } else {
                    // Count the nested parts skipped with it, so the
                    // numbering does not depend on which values are there.
                    *seen += count_optional(inner);
                }
            }
            Piece::Field { name, filters } => {
                if let Some(v) = values.get(name) {
                    out.push_str(&apply(v, filters, style));
                }
            }
        }
    }
}

fn apply(v: &Value, filters: &[Filter], style: Style) -> String {
    let mut text: Option<String> = None;
    for f in filters {
        let t = match f {
            Filter::Join(conj) => v.render_joined(style, conj),
            Filter::Count { singular, plural } => {
                let n = v.count();
                let noun = if n == 1 {
                    singular.clone()
                } else {
                    plural.clone().unwrap_or_else(|| words::plural(singular))
                };
                let t = format!("{} {noun}", int_words(n, style, false));
                if style == Style::Ssml {
                    xml_escape(&t)
                } else {
                    t
                }
            }
            Filter::Ordinal => words::ordinal(v.count().unsigned_abs()),
            Filter::Nth => match style {
                Style::Text => words::ordinal_figure(v.count().unsigned_abs()),
                Style::Spoken => words::ordinal(v.count().unsigned_abs()),
                Style::Ssml => Value::ordinal(v.count().unsigned_abs()).render(style),
            },
            Filter::Figure => match v {
                Value::Int(n) => int_words(*n, style, true),
                other => other.render(style),
            },
            Filter::Verb { one, many } => {
                let w = if v.count() == 1 { one } else { many };
                if style == Style::Ssml {
                    xml_escape(w)
                } else {
                    w.clone()
                }
            }
            // Capitals are for the eye: spoken, a word is the same word
            // (and an engine may spell out a word in capitals), so case
            // filters leave spoken text and SSML as they are.
            Filter::Upper | Filter::Lower if style.is_spoken() => {
                text.clone().unwrap_or_else(|| v.render(style))
            }
            Filter::Upper => text
                .clone()
                .unwrap_or_else(|| v.render(style))
                .to_uppercase(),
            Filter::Lower => text
                .clone()
                .unwrap_or_else(|| v.render(style))
                .to_lowercase(),
            Filter::Article => {
                let t = text.clone().unwrap_or_else(|| v.render(style));
                format!("{} {t}", words::indefinite_article(&t))
            }
        };
        text = Some(t);
    }
    text.unwrap_or_else(|| v.render(style))
}

/// Collapses runs of spaces and removes spaces before punctuation, which
/// optional parts leave behind when they are dropped.
fn tidy_spaces(s: &str) -> String {
    let mut out = String::with_capacity(s.len());
    for c in s.chars() {
        if c == ' ' && (out.ends_with(' ') || out.is_empty()) {
            continue;
        }
        if matches!(c, ',' | '.' | ';' | ':' | '!' | '?') && out.ends_with(' ') {
            out.pop();
        }
        out.push(c);
    }
    out.trim_end().to_string()
}

#[cfg(test)]
mod tests {
    use super::*;

    use crate::answers::value::values_of as vals;

    #[test]
    fn optional_parts_drop_when_a_value_is_missing() {
        let t = Template::parse("{gold} won[, ahead of {silver}].").unwrap();
        assert_eq!(
            t.render(&vals(&[("gold", "A".into())]), Style::Text),
            "A won."
        );
        assert_eq!(
            t.render(
                &vals(&[("gold", "A".into()), ("silver", "B".into())]),
                Style::Text
            ),
            "A won, ahead of B."
        );
    }

    #[test]
    fn counts_agree_with_their_noun() {
        let t = Template::parse("{n|count:medal} {n|verb:was:were} won").unwrap();
        assert_eq!(
            t.render(&vals(&[("n", Value::Int(1))]), Style::Text),
            "One medal was won"
        );
        assert_eq!(
            t.render(&vals(&[("n", Value::Int(3))]), Style::Text),
            "Three medals were won"
        );
        assert_eq!(
            t.render(&vals(&[("n", Value::Int(14))]), Style::Text),
            "14 medals were won"
        );
    }

    #[test]
    fn lists_join_with_or() {
        let t = Template::parse("{x|or}?").unwrap();
        let v: Value = vec!["A".to_string(), "B".to_string(), "C".to_string()].into();
        assert_eq!(t.render(&vals(&[("x", v)]), Style::Text), "A, B or C?");
    }

    #[test]
    fn ordinals_in_words_and_figures() {
        let t = Template::parse("{p|ordinal} / {p|nth}").unwrap();
        assert_eq!(
            t.render(&vals(&[("p", Value::Int(22))]), Style::Text),
            "Twenty-second / 22nd"
        );
        assert_eq!(
            t.render(&vals(&[("p", Value::Int(22))]), Style::Spoken),
            "Twenty-second / twenty-second"
        );
    }

    #[test]
    fn errors_point_at_the_problem() {
        assert_eq!(Template::parse("hello {name").unwrap_err().offset, 6);
        assert_eq!(Template::parse("a [b {c}").unwrap_err().offset, 2);
        assert!(Template::parse("{x|shout}")
            .unwrap_err()
            .message
            .contains("unknown filter"));
        assert!(Template::parse("{two words}").is_err());
        assert!(Template::parse("a ] b").is_err());
    }

    #[test]
    fn names_are_listed_in_order() {
        let t = Template::parse("{a} [{b|and} {c}]").unwrap();
        assert_eq!(t.names(), vec!["a", "b", "c"]);
    }

    #[test]
    fn ssml_escapes_names_and_marks_ordinals_and_pauses() {
        let t = Template::parse("{who|and} finished {place|nth} & won (a medal).").unwrap();
        let who: Value = vec!["<break time=\"9s\"/> & Co".to_string(), "B".to_string()].into();
        let out = t.render(
            &vals(&[("who", who), ("place", Value::Int(2))]),
            Style::Ssml,
        );
        assert_eq!(
            out,
            "&lt;break time=9s &gt; and Co<break time=\"200ms\"/> and B finished \
             <say-as interpret-as=\"ordinal\">2nd</say-as> and won, a medal."
        );
    }

    #[test]
    fn optional_parts_are_dropped_from_the_last_written() {
        let t = Template::parse("A[ b][ c{x}][ d].").unwrap();
        let v = vals(&[("x", "!".into())]);
        assert_eq!(t.optional_parts(), 3);
        assert_eq!(t.render_keeping(&v, Style::Text, 3), "A b c! d.");
        assert_eq!(t.render_keeping(&v, Style::Text, 2), "A b c!.");
        assert_eq!(t.render_keeping(&v, Style::Text, 0), "A.");
        let short = t.render_fitting(&v, Style::Text, &|s| s.len() <= 5);
        assert_eq!(short.as_deref(), Some("A b."));
        assert_eq!(t.render_fitting(&v, Style::Text, &|s| s.len() < 2), None);
    }
}
