//! Channel profiles: how a reply is shaped for where it is read or heard.
//!
//! A profile is configuration, not code: the built-in ones (`chat`, `sms`,
//! `voice`, `plain`) come from `src/answers/channels.yaml`, and an intents
//! folder's own `channels.yaml` may replace them or add more. The realiser
//! ([`crate::dialogue::turn`]) reads a profile to choose written or spoken
//! words, to fit a length (an SMS segment, a voice prompt), to build SSML,
//! to offer quick replies and to cite how fresh the data are.

use std::collections::BTreeMap;

use serde::Deserialize;
use serde_saphyr::Spanned;

use super::sms;
use super::value::Style;
use crate::catalog::CatalogProblem;

/// The built-in profiles.
pub const BUILT_IN: &str = include_str!("channels.yaml");

/// How replies are shaped for one channel.
#[derive(Debug, Clone, PartialEq)]
pub struct Profile {
    pub name: String,
    pub summary: String,
    /// Written words ("9.93 s", "20:50") or spoken ones ("nine point nine
    /// three seconds", "twenty fifty").
    pub spoken: bool,
    /// Whether replies carry an SSML 1.1 document.
    pub ssml: bool,
    /// The language of the SSML document (`xml:lang`).
    pub language: String,
    /// Longest reply text, in characters.
    pub max_length: Option<usize>,
    /// Whether a reply must fit one SMS segment.
    pub one_sms_segment: bool,
    /// How many quick replies to offer at most.
    pub quick_replies: usize,
    /// Whether replies carry a copy with light emphasis (Markdown bold).
    pub emphasis: bool,
    /// Whether answers from the data say how fresh they are ("As of 21:04").
    pub freshness: bool,
    /// Shorter forms of words and phrases, used only when a reply does not
    /// fit otherwise ("women's" → "W"), whole words only.
    pub shorter: Vec<(String, String)>,
}

impl Profile {
    /// The style values are rendered in for the reply text.
    pub fn style(&self) -> Style {
        if self.spoken {
            Style::Spoken
        } else {
            Style::Text
        }
    }

    /// The text with the profile's shorter forms, whole words only.
    pub fn shortened(&self, text: &str) -> String {
        let mut out = text.to_string();
        for (long, short) in &self.shorter {
            out = replace_words(&out, long, short);
        }
        out
    }

    /// Whether a reply text is short enough for this channel.
    pub fn fits(&self, text: &str) -> bool {
        self.max_length.is_none_or(|n| text.chars().count() <= n)
            && (!self.one_sms_segment || sms::measure(text).fits_one_segment())
    }
}

/// The channel profiles in force, by name.
#[derive(Debug, Clone, PartialEq)]
pub struct Channels {
    profiles: BTreeMap<String, Profile>,
}

impl Channels {
    /// The built-in profiles.
    pub fn built_in() -> Channels {
        let mut problems = Vec::new();
        let profiles = parse("src/answers/channels.yaml", BUILT_IN, &mut problems);
        assert!(
            problems.is_empty(),
            "the built-in channel profiles are checked by a unit test: {problems:?}"
        );
        Channels { profiles }
    }

    /// The built-in profiles with an intents folder's `channels.yaml` over
    /// them; problems are reported with file, line and column.
    pub fn with_file(file: &str, text: &str, problems: &mut Vec<CatalogProblem>) -> Channels {
        let mut c = Channels::built_in();
        c.profiles.extend(parse(file, text, problems));
        c
    }

    /// The profile with this name.
    pub fn get(&self, name: &str) -> Option<&Profile> {
        self.profiles.get(name)
    }

    /// Every channel name, sorted.
    pub fn names(&self) -> Vec<&str> {
        self.profiles.keys().map(String::as_str).collect()
    }
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct ProfileFile {
    #[serde(default)]
    summary: String,
    words: Spanned<String>,
    #[serde(default)]
    ssml: bool,
    #[serde(default)]
    language: Option<String>,
    #[serde(default)]
    max_length: Option<Spanned<usize>>,
    #[serde(default)]
    fit: Option<Spanned<String>>,
    #[serde(default)]
    quick_replies: usize,
    #[serde(default)]
    emphasis: bool,
    #[serde(default)]
    freshness: bool,
    #[serde(default)]
    shorter: BTreeMap<String, String>,
}

/// Replaces `long` where it stands as whole words (not inside another
/// word: "men's" is not replaced inside "women's").
fn replace_words(text: &str, long: &str, short: &str) -> String {
    if long.is_empty() {
        return text.to_string();
    }
    let mut out = String::with_capacity(text.len());
    let mut rest = text;
    while let Some(i) = rest.find(long) {
        let before = rest[..i].chars().next_back();
        let after = rest[i + long.len()..].chars().next();
        let boundary = |c: Option<char>| c.is_none_or(|c| !c.is_alphanumeric() && c != '\'');
        out.push_str(&rest[..i]);
        if boundary(before) && boundary(after) {
            out.push_str(short);
        } else {
            out.push_str(long);
        }
        rest = &rest[i + long.len()..];
    }
    out.push_str(rest);
    out
}

fn parse(file: &str, text: &str, problems: &mut Vec<CatalogProblem>) -> BTreeMap<String, Profile> {
    let raw: BTreeMap<String, ProfileFile> = match serde_saphyr::from_str(text) {
        Ok(r) => r,
        Err(e) => {
            problems.push(crate::catalog::yaml_problem(file, &e));
            return BTreeMap::new();
        }
    };
    let mut out = BTreeMap::new();
    for (name, p) in raw {
        let at = |s: &serde_saphyr::Location, message: String| CatalogProblem {
            file: file.to_string(),
            line: s.line(),
            column: s.column(),
            message,
        };
        let spoken = match p.words.value.as_str() {
            "written" => false,
            "spoken" => true,
            other => {
                problems.push(at(
                    &p.words.referenced,
                    format!("channel {name}: words must be written or spoken, not {other:?}"),
                ));
                continue;
            }
        };
        let one_sms_segment = match p.fit.as_ref().map(|f| f.value.as_str()) {
            None => false,
            Some("one_sms_segment") => true,
            Some(other) => {
                let f = p.fit.as_ref().expect("matched Some");
                problems.push(at(
                    &f.referenced,
                    format!("channel {name}: fit can only be one_sms_segment, not {other:?}"),
                ));
                continue;
            }
        };
        if let Some(m) = &p.max_length {
            if m.value < 40 {
                problems.push(at(
                    &m.referenced,
                    format!(
                        "channel {name}: max_length {} is too short for any answer; use 40 or more",
                        m.value
                    ),
                ));
                continue;
            }
        }
        if p.ssml && !spoken {
            problems.push(at(
                &p.words.referenced,
                format!("channel {name}: ssml needs words: spoken"),
            ));
            continue;
        }
        out.insert(
            name.clone(),
            Profile {
                name,
                summary: p.summary,
                spoken,
                ssml: p.ssml,
                language: p.language.unwrap_or_else(|| "en-GB".into()),
                max_length: p.max_length.map(|m| m.value),
                one_sms_segment,
                quick_replies: p.quick_replies,
                emphasis: p.emphasis,
                freshness: p.freshness,
                // Longest first, so a phrase is shortened before a word in it.
                shorter: {
                    let mut v: Vec<(String, String)> = p.shorter.into_iter().collect();
                    v.sort_by_key(|(l, _)| std::cmp::Reverse(l.len()));
                    v
                },
            },
        );
    }
    out
}

/// Marks where emphasis opens in a reply being rendered for Markdown,
/// before escaping: private-use characters no data or wording holds (they
/// are removed from values first), turned into `**` by [`markdown`].
pub const EMPHASIS_OPEN: char = '\u{E000}';
/// Marks where emphasis closes; see [`EMPHASIS_OPEN`].
pub const EMPHASIS_CLOSE: char = '\u{E001}';

/// A reply's text as CommonMark that shows exactly that text: every
/// character that could open markup (links, images, raw HTML and
/// autolinks, entities, emphasis, code, and GFM strikethrough and tables)
/// is backslash-escaped (an image's `!` needs no escape once its `[` has
/// one; CommonMark 0.31, §2.4 "Backslash escapes": any
/// ASCII punctuation may be escaped), and so is what would start a block at
/// the start of a line (headings, quotes, list items). The emphasis marks
/// become `**`. Names from the data therefore reach a chat client as text,
/// never as a live link or tag.
pub fn markdown(text: &str) -> String {
    let mut out = String::with_capacity(text.len() + 8);
    let mut line_start = true;
    let chars: Vec<char> = text.chars().collect();
    for (i, &c) in chars.iter().enumerate() {
        match c {
            EMPHASIS_OPEN | EMPHASIS_CLOSE => out.push_str("**"),
            // As in plain text: no controls, no bidirectional overrides.
            _ if hidden_control(c) => {}
            '\\' | '`' | '*' | '_' | '[' | ']' | '<' | '>' | '&' | '~' | '|' => {
                out.push('\\');
                out.push(c);
            }
            '#' | '+' | '-' | '=' if line_start => {
                out.push('\\');
                out.push(c);
            }
            // "1." or "1)" opening a line would start an ordered list.
            '.' | ')' if line_start_digits(&chars, i) => {
                out.push('\\');
                out.push(c);
            }
            _ => out.push(c),
        }
        if c == '\n' {
            line_start = true;
        } else if !(c == ' ' || (line_start && c.is_ascii_digit())) {
            line_start = false;
        }
    }
    out
}

/// Whether `chars[..i]` is only spaces and digits since the line began.
fn line_start_digits(chars: &[char], i: usize) -> bool {
    let mut j = i;
    let mut digits = 0;
    while j > 0 && chars[j - 1].is_ascii_digit() {
        j -= 1;
        digits += 1;
    }
    while j > 0 && chars[j - 1] == ' ' {
        j -= 1;
    }
    digits > 0 && (j == 0 || chars[j - 1] == '\n')
}

/// Text for fields that clients show as plain text (`text`, quick
/// replies): no markup is added or escaped, and characters that would
/// change how the rest is shown are removed: control characters and the
/// Unicode bidirectional controls (which can make a name read backwards)
/// and the emphasis marks.
pub fn plain_text(text: &str) -> String {
    text.chars()
        .filter(|&c| !hidden_control(c) && c != EMPHASIS_OPEN && c != EMPHASIS_CLOSE)
        .collect()
}

/// Control characters (but the line break) and the Unicode bidirectional
/// controls.
fn hidden_control(c: char) -> bool {
    (c.is_control() && c != '\n')
        || matches!(
            c,
            '\u{202A}'..='\u{202E}' | '\u{2066}'..='\u{2069}' | '\u{200E}' | '\u{200F}' | '\u{061C}'
        )
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_built_in_profiles_load() {
        let mut problems = Vec::new();
        let p = parse("channels.yaml", BUILT_IN, &mut problems);
        assert!(problems.is_empty(), "{problems:?}");
        assert_eq!(
            p.keys().map(String::as_str).collect::<Vec<_>>(),
            vec!["chat", "plain", "sms", "voice"]
        );
        assert!(p["voice"].ssml && p["voice"].spoken);
        assert!(p["sms"].one_sms_segment);
        assert_eq!(p["chat"].quick_replies, 3);
    }

    #[test]
    fn shorter_forms_replace_whole_words_only() {
        assert_eq!(
            replace_words("the women's and men's 100 m", "men's", "M"),
            "the women's and M 100 m"
        );
        let c = Channels::built_in();
        let sms = c.get("sms").unwrap();
        assert_eq!(
            sms.shortened("the women's 400 m individual medley"),
            "the W 400 m IM"
        );
    }

    #[test]
    fn a_profile_file_adds_and_replaces_with_problems_located() {
        let mut problems = Vec::new();
        let c = Channels::with_file(
            "my/channels.yaml",
            "kiosk:\n  words: written\n  max_length: 280\nplain:\n  words: spoken\n",
            &mut problems,
        );
        assert!(problems.is_empty(), "{problems:?}");
        assert_eq!(c.get("kiosk").unwrap().max_length, Some(280));
        assert!(c.get("plain").unwrap().spoken);
        assert!(c.get("voice").is_some());

        let mut problems = Vec::new();
        Channels::with_file(
            "my/channels.yaml",
            "kiosk:\n  words: shouted\n",
            &mut problems,
        );
        assert_eq!(problems.len(), 1);
        assert_eq!((problems[0].line, problems[0].column), (2, 10));
        assert!(problems[0].message.contains("written or spoken"));

        let mut problems = Vec::new();
        Channels::with_file(
            "my/channels.yaml",
            "kiosk:\n  word: written\n",
            &mut problems,
        );
        assert_eq!(problems.len(), 1);
        assert_eq!(problems[0].line, 2, "{problems:?}");
    }
}
