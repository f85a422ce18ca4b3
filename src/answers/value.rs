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
}

/// One value an operation produced.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(untagged)]
pub enum Value {
    /// Running text, printed as is.
    Text(String),
    /// A whole number; in running text one to nine are written as words.
    Int(i64),
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
            Value::Text(s) => !s.is_empty(),
            Value::Int(n) => *n != 0,
            Value::Dual { text, .. } => !text.is_empty(),
            Value::List(v) => !v.is_empty(),
        }
    }

    /// How many things the value stands for, for agreement ("was"/"were").
    pub fn count(&self) -> i64 {
        match self {
            Value::Int(n) => *n,
            Value::List(v) => v.len() as i64,
            _ => 1,
        }
    }

    /// Renders the value on its own, lists joined with "and".
    pub fn render(&self, style: Style) -> String {
        match self {
            Value::Text(s) => s.clone(),
            Value::Int(n) => int_words(*n, style, false),
            Value::Dual { text, spoken } => match style {
                Style::Text => text.clone(),
                Style::Spoken => spoken.clone(),
            },
            Value::List(items) => {
                let parts: Vec<String> = items.iter().map(|v| v.render(style)).collect();
                words::join_list(&parts, "and")
            }
        }
    }
}

/// A whole number for running text: words from one to nine (common
/// newsroom practice), figures above, and always words when spoken.
pub fn int_words(n: i64, style: Style, figures: bool) -> String {
    let neg = if n < 0 { "minus " } else { "" };
    let abs = n.unsigned_abs();
    match (style, figures) {
        (Style::Spoken, _) => format!("{neg}{}", words::cardinal(abs)),
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
