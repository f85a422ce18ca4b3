//! Test-side tools for voice replies: checking an SSML document against the
//! standards it claims, rendering it with a real synthesiser to measure it,
//! and scoring how easy its words are to follow by ear.
//!
//! Sources, each named again on the function that uses it:
//! - Speech Synthesis Markup Language (SSML) Version 1.1, W3C Recommendation,
//!   7 September 2010 (REC-speech-synthesis11-20100907).
//! - SSML 1.0 say-as attribute values, W3C Working Group Note, 26 May 2005
//!   (NOTE-ssml-sayas-20050526).
//! - Extensible Markup Language (XML) 1.0, as parsed by the `roxmltree` crate.
//! - Rudolf Flesch, "A new readability yardstick", Journal of Applied
//!   Psychology 32 (1948), 221-233.
//! - eSpeak NG (Debian package `espeak-ng`) and the RIFF/WAVE file format.
//!
//! Where a rule below could not be checked against the text of its source
//! while writing it, its comment says "from memory".

use std::io::Write;
use std::path::PathBuf;
use std::process::{Command, Stdio};
use std::sync::atomic::{AtomicUsize, Ordering};

/// The SSML namespace (SSML 1.1 §2.1).
pub const SSML_NS: &str = "http://www.w3.org/2001/10/synthesis";
/// The namespace of `xml:lang`, `xml:base`, `xml:id` (Namespaces in XML 1.0 §3).
const XML_NS: &str = "http://www.w3.org/XML/1998/namespace";
/// The namespace of `xsi:schemaLocation` (XML Schema Part 1 §2.6).
const XSI_NS: &str = "http://www.w3.org/2001/XMLSchema-instance";

/// An attribute name as the table below writes it: its namespace (None for
/// an unprefixed attribute) and its local name.
type AttrName = (Option<&'static str>, &'static str);

const XML_LANG: AttrName = (Some(XML_NS), "lang");
const ONLANGFAILURE: AttrName = (None, "onlangfailure");

/// Every element SSML 1.1 defines and the attributes it defines for each
/// (SSML 1.1 §2 and §3: 3.1.1 speak, 3.1.4 lexicon, 3.1.5 lookup,
/// 3.1.6 meta/metadata, 3.1.7 p and s, 3.1.8 token and w, 3.1.9 lang (new in
/// 1.1), 3.1.10 say-as, 3.1.11 phoneme, 3.1.12 sub, 3.2.1 voice,
/// 3.2.2 emphasis, 3.2.3 break, 3.2.4 prosody, 3.3.1 audio, 3.3.2 mark,
/// 3.3.3 desc; section numbers from memory). Namespace declarations
/// (`xmlns`, `xmlns:xsi`) are not attributes in the XML data model and so are
/// not listed. `xml:lang` on token and w is from memory.
const ELEMENTS: &[(&str, &[AttrName])] = &[
    (
        "speak",
        &[
            (None, "version"),
            XML_LANG,
            (Some(XML_NS), "base"),
            (Some(XSI_NS), "schemaLocation"),
            ONLANGFAILURE,
        ],
    ),
    (
        "lexicon",
        &[
            (None, "uri"),
            (Some(XML_NS), "id"),
            (None, "type"),
            (None, "fetchtimeout"),
            (None, "maxage"),
            (None, "maxstale"),
        ],
    ),
    ("lookup", &[(None, "ref")]),
    (
        "meta",
        &[(None, "name"), (None, "http-equiv"), (None, "content")],
    ),
    ("metadata", &[]),
    ("p", &[XML_LANG, ONLANGFAILURE]),
    ("s", &[XML_LANG, ONLANGFAILURE]),
    ("token", &[XML_LANG, ONLANGFAILURE, (None, "role")]),
    ("w", &[XML_LANG, ONLANGFAILURE, (None, "role")]),
    // The brief's list left `lang` out; SSML 1.1 §3.1.9 defines it.
    ("lang", &[XML_LANG, ONLANGFAILURE]),
    (
        "say-as",
        &[(None, "interpret-as"), (None, "format"), (None, "detail")],
    ),
    ("phoneme", &[(None, "ph"), (None, "alphabet")]),
    ("sub", &[(None, "alias")]),
    (
        "voice",
        &[
            (None, "gender"),
            (None, "age"),
            (None, "variant"),
            (None, "name"),
            (None, "languages"),
            (None, "required"),
            (None, "ordering"),
            (None, "onvoicefailure"),
        ],
    ),
    ("emphasis", &[(None, "level")]),
    ("break", &[(None, "time"), (None, "strength")]),
    (
        "prosody",
        &[
            (None, "pitch"),
            (None, "contour"),
            (None, "range"),
            (None, "rate"),
            (None, "duration"),
            (None, "volume"),
        ],
    ),
    (
        "audio",
        &[
            (None, "src"),
            (None, "fetchtimeout"),
            (None, "fetchhint"),
            (None, "maxage"),
            (None, "maxstale"),
            (None, "clipBegin"),
            (None, "clipEnd"),
            (None, "repeatCount"),
            (None, "repeatDur"),
            (None, "soundLevel"),
            (None, "speed"),
        ],
    ),
    ("mark", &[(None, "name")]),
    ("desc", &[XML_LANG]),
];

/// `break strength` values (SSML 1.1 §3.2.3).
const BREAK_STRENGTHS: &[&str] = &["none", "x-weak", "weak", "medium", "strong", "x-strong"];

/// `emphasis level` values (SSML 1.1 §3.2.2).
const EMPHASIS_LEVELS: &[&str] = &["strong", "moderate", "none", "reduced"];

/// `onlangfailure` values (SSML 1.1 §3.1.13 or near it; section from memory).
const ONLANGFAILURE_VALUES: &[&str] =
    &["changevoice", "ignoretext", "ignorelang", "processorchoice"];

/// The `say-as` `interpret-as` values of the W3C Note "SSML 1.0 say-as
/// attribute values" (26 May 2005), with the `format` values the Note gives
/// for each. `None` means any format value is accepted; an empty list means
/// the Note defines no format for that type, so any `format` is an error.
///
/// - The six types and the ten date formats agree with the Note as quoted in
///   published vendor documentation; checked.
/// - time formats: from memory (only hms12 and hms24 seen quoted).
/// - telephone: from memory, the Note's `format` is a country calling code
///   (ITU-T E.164), checked here as one to three digits.
/// - characters formats `characters` and `glyphs`: from memory.
/// - cardinal and ordinal taking no `format`: from memory.
/// - `detail` is not checked: from memory the Note leaves its values open.
fn say_as_formats(interpret_as: &str) -> Option<Option<&'static [&'static str]>> {
    const DATE: &[&str] = &["mdy", "dmy", "ymd", "md", "dm", "ym", "my", "d", "m", "y"];
    const TIME: &[&str] = &["hms12", "hms24", "hm12", "hm24", "h12", "h24"];
    const CHARACTERS: &[&str] = &["characters", "glyphs"];
    match interpret_as {
        "date" => Some(Some(DATE)),
        "time" => Some(Some(TIME)),
        "telephone" => Some(None),
        "characters" => Some(Some(CHARACTERS)),
        "cardinal" | "ordinal" => Some(Some(&[])),
        _ => None,
    }
}

/// Checks `doc` as an SSML 1.1 document.
///
/// Sources: XML 1.0 (parsed with `roxmltree`); SSML 1.1, W3C Recommendation
/// 7 September 2010; the W3C Note "SSML 1.0 say-as attribute values",
/// 26 May 2005.
///
/// Checks that the document is well-formed XML; that its root is `speak` in
/// the SSML namespace with `version="1.1"` and a non-empty `xml:lang`; that
/// every element is one SSML 1.1 defines, in its namespace, carrying only the
/// attributes SSML 1.1 defines for it; that `break` has a CSS2 time (`250ms`,
/// `1s`, `0.5s`) and a defined strength; that `emphasis level` and
/// `onlangfailure` take defined values; and that `say-as` has an
/// `interpret-as` (and `format`) from the Note. Content of `metadata` is any
/// XML (SSML 1.1 allows other schemas there) and is not checked. Stricter
/// than the Recommendation in one way: elements and attributes from other
/// namespaces are refused outside `metadata`, since Tidings writes none.
pub fn check_ssml(doc: &str) -> Result<(), String> {
    let parsed =
        roxmltree::Document::parse(doc).map_err(|e| format!("not well-formed XML 1.0: {e}"))?;
    let root = parsed.root_element();
    let at = |node: roxmltree::Node| {
        let pos = parsed.text_pos_at(node.range().start);
        format!("line {}, column {}", pos.row, pos.col)
    };

    if root.tag_name().name() != "speak" {
        return Err(format!(
            "root element is <{}> ({}), SSML requires <speak>",
            root.tag_name().name(),
            at(root)
        ));
    }
    match root.tag_name().namespace() {
        Some(SSML_NS) => {}
        Some(other) => {
            return Err(format!(
                "root <speak> is in namespace {other:?}, SSML 1.1 requires {SSML_NS:?}"
            ))
        }
        None => {
            return Err(format!(
                "root <speak> is in no namespace, SSML 1.1 requires xmlns=\"{SSML_NS}\""
            ))
        }
    }
    match root.attribute("version") {
        Some("1.1") => {}
        Some(v) => {
            return Err(format!(
                "<speak version=\"{v}\">: SSML 1.1 requires version=\"1.1\""
            ))
        }
        None => {
            return Err(
                "<speak> has no version attribute: SSML 1.1 requires version=\"1.1\"".into(),
            )
        }
    }
    match root.attribute((XML_NS, "lang")) {
        Some(lang) if !lang.trim().is_empty() => {}
        Some(_) => return Err("<speak xml:lang=\"\">: the language is empty".into()),
        None => return Err("<speak> has no xml:lang attribute, which SSML 1.1 requires".into()),
    }

    check_element(root, &at)
}

fn check_element(
    node: roxmltree::Node,
    at: &dyn Fn(roxmltree::Node) -> String,
) -> Result<(), String> {
    let name = node.tag_name().name();
    let ns = node.tag_name().namespace();
    let Some((_, allowed)) = ELEMENTS.iter().find(|(n, _)| *n == name) else {
        return Err(format!(
            "element <{name}> ({}) is not an SSML 1.1 element",
            at(node)
        ));
    };
    if ns != Some(SSML_NS) {
        return Err(format!(
            "element <{name}> ({}) is in namespace {:?}, not the SSML namespace {SSML_NS:?}",
            at(node),
            ns.unwrap_or("(none)")
        ));
    }
    if name == "speak" && node.parent_element().is_some() {
        return Err(format!(
            "<speak> ({}) may only be the root element",
            at(node)
        ));
    }

    for attr in node.attributes() {
        let key = (attr.namespace(), attr.name());
        if !allowed
            .iter()
            .any(|(a_ns, a_name)| *a_ns == key.0 && *a_name == key.1)
        {
            let shown = match key.0 {
                Some(XML_NS) => format!("xml:{}", key.1),
                Some(XSI_NS) => format!("xsi:{}", key.1),
                Some(other) => format!("{{{other}}}{}", key.1),
                None => key.1.to_string(),
            };
            return Err(format!(
                "attribute {shown}=\"{}\" on <{name}> ({}) is not one SSML 1.1 defines for <{name}>",
                attr.value(),
                at(node)
            ));
        }
    }
    if let Some(v) = node.attribute("onlangfailure") {
        if !ONLANGFAILURE_VALUES.contains(&v) {
            return Err(format!(
                "<{name} onlangfailure=\"{v}\"> ({}): expected one of {}",
                at(node),
                ONLANGFAILURE_VALUES.join("|")
            ));
        }
    }

    match name {
        "break" => {
            if let Some(t) = node.attribute("time") {
                if !is_css2_time(t) {
                    return Err(format!(
                        "<break time=\"{t}\"> ({}): not a CSS2 time such as 250ms or 1s",
                        at(node)
                    ));
                }
            }
            if let Some(s) = node.attribute("strength") {
                if !BREAK_STRENGTHS.contains(&s) {
                    return Err(format!(
                        "<break strength=\"{s}\"> ({}): expected one of {}",
                        at(node),
                        BREAK_STRENGTHS.join("|")
                    ));
                }
            }
        }
        "emphasis" => {
            if let Some(l) = node.attribute("level") {
                if !EMPHASIS_LEVELS.contains(&l) {
                    return Err(format!(
                        "<emphasis level=\"{l}\"> ({}): expected one of {}",
                        at(node),
                        EMPHASIS_LEVELS.join("|")
                    ));
                }
            }
        }
        "say-as" => check_say_as(node, at)?,
        "metadata" => return Ok(()), // any schema inside (SSML 1.1 §3.1.6)
        _ => {}
    }

    for child in node.children().filter(|c| c.is_element()) {
        check_element(child, at)?;
    }
    Ok(())
}

fn check_say_as(
    node: roxmltree::Node,
    at: &dyn Fn(roxmltree::Node) -> String,
) -> Result<(), String> {
    let Some(kind) = node.attribute("interpret-as") else {
        return Err(format!(
            "<say-as> ({}) has no interpret-as attribute, which SSML 1.1 requires",
            at(node)
        ));
    };
    let Some(formats) = say_as_formats(kind) else {
        return Err(format!(
            "<say-as interpret-as=\"{kind}\"> ({}): not a value of the W3C Note \
             \"SSML 1.0 say-as attribute values\" (date, time, telephone, characters, cardinal, ordinal)",
            at(node)
        ));
    };
    let Some(format) = node.attribute("format") else {
        return Ok(());
    };
    let ok = match formats {
        None => {
            !format.is_empty() && format.len() <= 3 && format.bytes().all(|b| b.is_ascii_digit())
        }
        Some(list) => list.contains(&format),
    };
    if ok {
        return Ok(());
    }
    let expected = match formats {
        None => "a country calling code of 1-3 digits".to_string(),
        Some([]) => format!("no format at all for {kind}"),
        Some(list) => format!("one of {}", list.join("|")),
    };
    Err(format!(
        "<say-as interpret-as=\"{kind}\" format=\"{format}\"> ({}): the say-as Note allows {expected}",
        at(node)
    ))
}

/// A CSS2 time as SSML 1.1 uses it (§3.2.3, "time value format from CSS2"):
/// a non-negative decimal number followed at once by `s` or `ms`.
fn is_css2_time(t: &str) -> bool {
    let number = t
        .strip_suffix("ms")
        .or_else(|| t.strip_suffix('s'))
        .unwrap_or("");
    let (whole, frac) = match number.split_once('.') {
        Some((w, f)) => (w, Some(f)),
        None => (number, None),
    };
    let digits = |s: &str| s.bytes().all(|b| b.is_ascii_digit());
    match frac {
        None => !whole.is_empty() && digits(whole),
        Some(f) => !f.is_empty() && digits(f) && digits(whole),
    }
}

/// Renders `ssml` with eSpeak NG and returns the length of the audio in
/// seconds.
///
/// Sources: eSpeak NG 1.51 (`espeak-ng -m --stdin -w FILE`: `-m` interprets
/// SSML markup, `--stdin` reads the whole document at once rather than line by
/// line, `-w` writes a WAV file); the RIFF/WAVE format (a `RIFF` header with
/// form type `WAVE`, then chunks: `fmt ` gives the byte rate, `data` gives the
/// sample bytes). Duration = data bytes / byte rate.
///
/// Errs with a message naming the fix when `espeak-ng` is not installed.
pub fn espeak_seconds(ssml: &str) -> Result<f64, String> {
    static COUNTER: AtomicUsize = AtomicUsize::new(0);
    let path = std::env::temp_dir().join(format!(
        "tidings-espeak-{}-{}.wav",
        std::process::id(),
        COUNTER.fetch_add(1, Ordering::Relaxed)
    ));
    let _cleanup = RemoveOnDrop(path.clone());

    let path_arg = path.display().to_string();
    run_espeak(&["-m", "--stdin", "-w", &path_arg], ssml)?;
    let bytes = std::fs::read(&path)
        .map_err(|e| format!("espeak-ng wrote no WAV file at {}: {e}", path.display()))?;
    wav_seconds(&bytes)
}

struct RemoveOnDrop(PathBuf);

impl Drop for RemoveOnDrop {
    fn drop(&mut self) {
        let _ = std::fs::remove_file(&self.0);
    }
}

/// The duration of a PCM WAV file: data chunk bytes / the fmt chunk's byte
/// rate (RIFF/WAVE format). A data size past the end of the file (as a
/// streaming writer may leave it) is cut to the bytes present.
fn wav_seconds(bytes: &[u8]) -> Result<f64, String> {
    let u32_at = |i: usize| -> Option<u32> {
        bytes
            .get(i..i + 4)
            .map(|b| u32::from_le_bytes([b[0], b[1], b[2], b[3]]))
    };
    if bytes.len() < 12 || &bytes[0..4] != b"RIFF" || &bytes[8..12] != b"WAVE" {
        return Err("not a RIFF/WAVE file".into());
    }
    let mut byte_rate = None;
    let mut pos = 12;
    while pos + 8 <= bytes.len() {
        let id = &bytes[pos..pos + 4];
        let size = u32_at(pos + 4).expect("checked length") as usize;
        let body = pos + 8;
        match id {
            b"fmt " => {
                // fmt: format tag (2), channels (2), sample rate (4), byte rate (4), ...
                let rate = u32_at(body + 8).ok_or("fmt chunk is cut short")?;
                if rate == 0 {
                    return Err("fmt chunk gives a byte rate of 0".into());
                }
                byte_rate = Some(rate);
            }
            b"data" => {
                let rate = byte_rate.ok_or("data chunk comes before any fmt chunk")?;
                let present = bytes.len().saturating_sub(body);
                return Ok(size.min(present) as f64 / f64::from(rate));
            }
            _ => {}
        }
        pos = body + size + (size & 1); // chunks are padded to an even length
    }
    Err("no data chunk in the WAV file".into())
}

/// Counts the syllables of one English word (hyphenated parts are counted
/// separately and added: "twenty-one" is 2 + 1).
///
/// Source: common practice, not a dictionary: the vowel-group heuristic used
/// by many readability tools. Vowels are a e i o u and y (y is a consonant at
/// the start of a word); each run of vowels is one syllable, then:
/// - a silent final e is taken off ("one", "minute"), except after a
///   consonant + l ("table", "little") and where the e is part of a vowel run
///   ("referee", "canoe");
/// - final -es is silent ("games", "scores") except after s, x, z, c, g, ch,
///   sh ("matches", "places") or consonant + l ("tables");
/// - final -ed is silent ("scored", "played") except after t or d ("wanted").
///
/// A word has at least one syllable; a string with no letters has none. Known
/// misses of the heuristic include split vowel pairs such as "stadium" and
/// "championship" (one short).
pub fn syllables(word: &str) -> usize {
    if word.contains('-') {
        return word.split('-').map(syllables).sum();
    }
    let w: Vec<char> = word
        .chars()
        .filter(|c| c.is_alphabetic())
        .flat_map(char::to_lowercase)
        .collect();
    if w.is_empty() {
        return 0;
    }
    let vowel_at = |i: usize| -> bool {
        match w[i] {
            'y' => i > 0,
            c => "aeiouàáâäèéêëìíîïòóôöùúûü".contains(c),
        }
    };
    let mut groups = 0;
    let mut in_group = false;
    for i in 0..w.len() {
        let v = vowel_at(i);
        if v && !in_group {
            groups += 1;
        }
        in_group = v;
    }

    let n = w.len();
    let text: String = w.iter().collect();
    let ends = |suffix: &str| text.ends_with(suffix);
    // A letter counted as a consonant for the ending rules (y is one here,
    // so "played" loses its -ed).
    let consonant = |i: usize| w[i] == 'y' || !vowel_at(i);
    if groups > 1 {
        if ends("e") && n >= 2 && consonant(n - 2) {
            let consonant_le = ends("le") && n >= 3 && consonant(n - 3);
            if !consonant_le {
                groups -= 1;
            }
        } else if ends("es") && n >= 3 && consonant(n - 3) {
            let sibilant =
                matches!(w[n - 3], 's' | 'x' | 'z' | 'c' | 'g') || ends("ches") || ends("shes");
            let consonant_les = w[n - 3] == 'l' && n >= 4 && consonant(n - 4);
            if !sibilant && !consonant_les {
                groups -= 1;
            }
        } else if ends("ed") && n >= 3 && consonant(n - 3) && !matches!(w[n - 3], 't' | 'd') {
            groups -= 1;
        }
    }
    groups.max(1)
}

/// Flesch Reading Ease from counts (Flesch 1948):
/// 206.835 − 1.015 × (words / sentences) − 84.6 × (syllables / words).
pub fn flesch_counts(words: usize, sentences: usize, syllables: usize) -> f64 {
    206.835 - 1.015 * (words as f64 / sentences as f64) - 84.6 * (syllables as f64 / words as f64)
}

/// Flesch Reading Ease (Flesch 1948) over a set of texts taken together: the
/// words, sentences and syllables of all the texts are added up and the
/// formula is applied once to the totals (not an average of per-text scores).
///
/// How this counts:
/// - A word is a run of letters; an apostrophe (' or ’) or a hyphen between
///   two letters joins them, so "don't" and "twenty-one" are one word each
///   (Flesch counted contractions and hyphenated words as one word; from
///   memory). Figures such as "2" are not words here: give this the words as
///   spoken ("two"), which is what a voice reply's text should hold.
/// - A sentence ends at a run of `.`, `!` or `?` that follows at least one
///   word; a `.` between two digits ("2.5") ends nothing. Words after the
///   last end mark make one more sentence, so a text with any word counts at
///   least one sentence. Abbreviations ("St.") are not special.
/// - Syllables are [`syllables`] of each word.
///
/// Returns NaN when the texts hold no word.
pub fn flesch_reading_ease(texts: &[&str]) -> f64 {
    let (mut words, mut sentences, mut syll) = (0, 0, 0);
    for text in texts {
        let chars: Vec<char> = text.chars().collect();
        let mut words_since_end = 0;
        let mut i = 0;
        while i < chars.len() {
            let c = chars[i];
            if c.is_alphabetic() {
                let start = i;
                while i < chars.len() {
                    let joins = matches!(chars[i], '\'' | '’' | '-')
                        && chars.get(i + 1).is_some_and(|n| n.is_alphabetic());
                    if chars[i].is_alphabetic() || joins {
                        i += 1;
                    } else {
                        break;
                    }
                }
                let word: String = chars[start..i].iter().collect();
                words += 1;
                words_since_end += 1;
                syll += syllables(&word);
                continue;
            }
            let decimal_point = c == '.'
                && i > 0
                && chars[i - 1].is_ascii_digit()
                && chars.get(i + 1).is_some_and(|n| n.is_ascii_digit());
            if matches!(c, '.' | '!' | '?') && !decimal_point && words_since_end > 0 {
                sentences += 1;
                words_since_end = 0;
            }
            i += 1;
        }
        if words_since_end > 0 {
            sentences += 1;
        }
    }
    if words == 0 {
        return f64::NAN;
    }
    flesch_counts(words, sentences, syll)
}

/// The phonemes espeak-ng would speak, as its `-x` output with stress
/// marks, pauses and spacing left out, so two inputs that say the same
/// words compare equal. `ssml` selects SSML input (`-m`) or plain text.
pub fn espeak_phonemes(input: &str, ssml: bool) -> Result<String, String> {
    let args: &[&str] = if ssml {
        &["-q", "-x", "--stdin", "-m"]
    } else {
        &["-q", "-x", "--stdin"]
    };
    let out = run_espeak(args, input)?;
    // A pause stops an "r" linking two words ("Brellmoor and" is said
    // "Brellmoor-r-and" without one): the linking marker is not a word
    // difference.
    let phonemes: String = String::from_utf8_lossy(&out)
        .chars()
        .filter(|c| !c.is_whitespace() && !matches!(c, '\'' | ',' | '_' | ':' | '|' | '!'))
        .collect();
    Ok(phonemes.replace("r-", ""))
}

/// Runs espeak-ng with `args`, `input` on its standard input; returns what
/// it printed. Errs with a message naming the fix when it is not installed.
fn run_espeak(args: &[&str], input: &str) -> Result<Vec<u8>, String> {
    let mut child = Command::new("espeak-ng")
        .args(args)
        .stdin(Stdio::piped())
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .map_err(|e| {
            if e.kind() == std::io::ErrorKind::NotFound {
                "espeak-ng is not installed: install the Debian package espeak-ng \
                 (apt-get install espeak-ng), or run `bash tests/run.sh`, which installs it"
                    .to_string()
            } else {
                format!("could not start espeak-ng: {e}")
            }
        })?;
    child
        .stdin
        .take()
        .expect("stdin is piped")
        .write_all(input.as_bytes())
        .map_err(|e| format!("could not write to espeak-ng: {e}"))?;
    // stdin is dropped above, closing it, so espeak-ng sees the end.
    let out = child
        .wait_with_output()
        .map_err(|e| format!("espeak-ng did not finish: {e}"))?;
    if !out.status.success() {
        return Err(format!(
            "espeak-ng failed ({}): {}",
            out.status,
            String::from_utf8_lossy(&out.stderr).trim()
        ));
    }
    Ok(out.stdout)
}
