//! The one canonical text form shared by readers' questions and dataset names.
//!
//! Everything that is compared — a reader's free text, an athlete's or
//! candidate's name, an event title — goes through [`normalize`] first, so a
//! match never depends on case, accents, full-width characters, apostrophe
//! style, or whether the reader typed "100m", "100 metres" or "one hundred
//! meters".
//!
//! The form is deliberately lossy (it drops diacritics and most punctuation):
//! it is for matching, never for display. It is idempotent, so a string that
//! was stored normalized can be normalized again without changing.

use unicode_normalization::char::is_combining_mark;
use unicode_normalization::UnicodeNormalization;

/// Unicode Normalization Form KC (compatibility decomposition followed by
/// canonical composition).
pub fn nfkc(s: &str) -> String {
    s.nfkc().collect()
}

/// Canonical matching form of `text`.
///
/// Steps, in order:
/// 1. NFKC, full Unicode lowercase, then diacritics folded away (NFD with the
///    combining marks dropped, plus letters that have no decomposition such
///    as `ł`, `ø`, `æ`, `ß`, `þ`).
/// 2. Apostrophes (`'`, `’`, `‘`, `ʼ`, `` ` ``) are removed, so "women's"
///    becomes "womens"; a middle dot between letters (Catalan `l·l`) is
///    removed too.
/// 3. Any other character that is not a letter or digit becomes a space,
///    except `.`, `:` and `,` between two ASCII digits ("10.12", "1:59.32").
///    A comma between digits that is followed by exactly three digits is a
///    thousands separator and is dropped ("1,234" → "1234").
/// 4. Distances are written one way: a number glued to or followed by
///    `m`/`metre(s)`/`meter(s)` becomes "`<n> m`", `km`/`kilometre(s)`/
///    `kilometer(s)` becomes "`<n> km`", and number words directly before
///    such a unit become digits ("two hundred and fifty metres" → "250 m").
///    Number words not followed by a unit are left alone ("top three").
/// 5. Whitespace is collapsed to single spaces and trimmed.
///
/// Idempotent: `normalize(&normalize(x)) == normalize(x)` for every `x`.
pub fn normalize(text: &str) -> String {
    let folded = fold(text);
    let spaced = punctuation(&folded);
    let out = numbers_and_units(&spaced);
    // Dropping marks after NFD leaves e.g. Hangul as loose jamo; recompose so
    // the stored form is compact and what a second pass would produce.
    if out.is_ascii() {
        out
    } else {
        out.nfc().collect()
    }
}

/// Splits a string produced by [`normalize`] into its words.
pub fn tokens(normalized: &str) -> Vec<&str> {
    // Split on any whitespace run rather than a single ' ' so a caller that
    // passes un-normalized text does not get empty tokens.
    normalized.split_whitespace().collect()
}

/// Step 1: NFKC, lowercase, fold diacritics and non-decomposing letters.
fn fold(text: &str) -> String {
    if text.is_ascii() {
        // NFKC and NFD are the identity on ASCII; skip the tables.
        return text.to_ascii_lowercase();
    }
    let lowered = nfkc(text).to_lowercase();
    let mut out = String::with_capacity(lowered.len());
    for c in lowered.nfd() {
        if is_combining_mark(c) {
            continue;
        }
        push_folded(&mut out, c);
    }
    out
}

/// Letters that carry a "diacritic" but have no canonical decomposition, so
/// NFD cannot strip them; readers type the plain Latin letters instead.
fn push_folded(out: &mut String, c: char) {
    match c {
        'ß' => out.push_str("ss"),
        'ł' => out.push('l'),
        'ø' => out.push('o'),
        'đ' | 'ð' => out.push('d'),
        'þ' => out.push_str("th"),
        'æ' => out.push_str("ae"),
        'œ' => out.push_str("oe"),
        'ı' => out.push('i'),
        'ŀ' => out.push('l'),
        'ħ' => out.push('h'),
        'ŧ' => out.push('t'),
        // Greek final sigma is only a positional variant of σ; readers who
        // type without it should still match.
        'ς' => out.push('σ'),
        _ => out.push(c),
    }
}

fn is_apostrophe(c: char) -> bool {
    matches!(c, '\'' | '\u{2019}' | '\u{2018}' | '\u{02BC}' | '`')
}

/// Steps 2 and 3: apostrophes, punctuation, digit separators.
fn punctuation(folded: &str) -> String {
    // Apostrophes are removed before looking at neighbours, so "1'000" and
    // "o'dara" see their letters/digits as adjacent, exactly as a second
    // pass over the output would.
    let raw: Vec<char> = folded.chars().filter(|&c| !is_apostrophe(c)).collect();
    let mut chars: Vec<char> = Vec::with_capacity(raw.len());
    for (i, &c) in raw.iter().enumerate() {
        // NFKC turns the Catalan "ŀ" into "l·"; "col·legi" should read as
        // one word, while a free-standing "·" is just a separator.
        if c == '\u{00B7}'
            && i > 0
            && raw[i - 1].is_alphabetic()
            && raw.get(i + 1).is_some_and(|n| n.is_alphabetic())
        {
            continue;
        }
        chars.push(c);
    }

    let digit_at = |i: usize| chars.get(i).is_some_and(char::is_ascii_digit);
    let mut out = String::with_capacity(chars.len());
    for (i, &c) in chars.iter().enumerate() {
        if c.is_alphanumeric() {
            out.push(c);
            continue;
        }
        let between_digits = i > 0 && digit_at(i - 1) && digit_at(i + 1);
        match c {
            ',' if between_digits => {
                let thousands =
                    digit_at(i + 1) && digit_at(i + 2) && digit_at(i + 3) && !digit_at(i + 4);
                if !thousands {
                    out.push(',');
                }
            }
            '.' | ':' if between_digits => out.push(c),
            _ => out.push(' '),
        }
    }
    out
}

/// Canonical spelling of a distance unit, if `word` is one.
fn unit(word: &str) -> Option<&'static str> {
    match word {
        "m" | "metre" | "metres" | "meter" | "meters" => Some("m"),
        "km" | "kilometre" | "kilometres" | "kilometer" | "kilometers" => Some("km"),
        _ => None,
    }
}

/// A written number as step 3 leaves it: ASCII digits, possibly with
/// `.`, `:` or `,` between digits.
fn is_numeral(word: &str) -> bool {
    let b = word.as_bytes();
    !b.is_empty()
        && b[0].is_ascii_digit()
        && b[b.len() - 1].is_ascii_digit()
        && b.iter()
            .all(|c| c.is_ascii_digit() || matches!(c, b'.' | b':' | b','))
}

/// Splits "100m" / "1.5km" / "100metres" into numeral and canonical unit.
fn split_glued(word: &str) -> Option<(&str, &'static str)> {
    let at = word.find(|c: char| c.is_ascii_alphabetic())?;
    let (num, rest) = word.split_at(at);
    if is_numeral(num) {
        unit(rest).map(|u| (num, u))
    } else {
        None
    }
}

fn small_number(word: &str) -> Option<u64> {
    crate::answers::words::UNITS
        .iter()
        .position(|w| *w == word)
        .map(|p| p as u64)
}

fn tens(word: &str) -> Option<u64> {
    const WORDS: [&str; 8] = [
        "twenty", "thirty", "forty", "fifty", "sixty", "seventy", "eighty", "ninety",
    ];
    WORDS
        .iter()
        .position(|w| *w == word)
        .map(|p| (p as u64 + 2) * 10)
}

pub(crate) fn is_number_word(word: &str) -> bool {
    matches!(word, "hundred" | "thousand" | "and")
        || small_number(word).is_some()
        || tens(word).is_some()
}

/// 1..=99 from one or two words ("seven", "fifteen", "forty two").
fn parse_below_100(words: &[&str], i: &mut usize) -> Option<u64> {
    let w = *words.get(*i)?;
    if let Some(t) = tens(w) {
        *i += 1;
        if let Some(u) = words.get(*i).and_then(|w| small_number(w)) {
            if (1..=9).contains(&u) {
                *i += 1;
                return Some(t + u);
            }
        }
        return Some(t);
    }
    match small_number(w) {
        Some(n) if n > 0 => {
            *i += 1;
            Some(n)
        }
        _ => None,
    }
}

/// 1..=9999 in the "[n] hundred [and] [m]" shape; "fifteen hundred" is
/// accepted because that is how the 1500 m is spoken.
fn parse_below_10000(words: &[&str], i: &mut usize) -> Option<u64> {
    let lead = parse_below_100(words, i)?;
    if words.get(*i) != Some(&"hundred") {
        return Some(lead);
    }
    *i += 1;
    let mut value = lead * 100;
    let save = *i;
    if words.get(*i) == Some(&"and") {
        *i += 1;
    }
    match parse_below_100(words, i) {
        Some(rest) => value += rest,
        None => *i = save,
    }
    Some(value)
}

/// Value of a complete run of number words, or `None` if the run is not a
/// well-formed number (every word must be consumed).
pub(crate) fn parse_number_words(words: &[&str]) -> Option<u64> {
    if words == ["zero"] {
        return Some(0);
    }
    let mut i = 0;
    let mut value = parse_below_10000(words, &mut i)?;
    if words.get(i) == Some(&"thousand") {
        i += 1;
        value *= 1000;
        let save = i;
        if words.get(i) == Some(&"and") {
            i += 1;
        }
        match parse_below_10000(words, &mut i) {
            Some(rest) if rest < 1000 => value += rest,
            _ => i = save,
        }
    }
    (i == words.len()).then_some(value)
}

/// Step 4 and 5: distances and whitespace.
fn numbers_and_units(spaced: &str) -> String {
    let mut words: Vec<&str> = Vec::new();
    for w in spaced.split_whitespace() {
        match split_glued(w) {
            Some((num, u)) => {
                words.push(num);
                words.push(u);
            }
            None => words.push(w),
        }
    }

    // Owned only where a run of number words was replaced by digits.
    let mut out: Vec<std::borrow::Cow<'_, str>> = Vec::with_capacity(words.len());
    for w in words {
        let Some(u) = unit(w) else {
            out.push(w.into());
            continue;
        };
        if out.last().is_some_and(|prev| is_numeral(prev)) {
            out.push(u.into());
            continue;
        }
        // The longest well-formed run of number words right before the unit.
        let run_start = out.len() - out.iter().rev().take_while(|p| is_number_word(p)).count();
        let mut replaced = false;
        for start in run_start..out.len() {
            let run: Vec<&str> = out[start..].iter().map(|c| c.as_ref()).collect();
            if let Some(value) = parse_number_words(&run) {
                out.truncate(start);
                out.push(value.to_string().into());
                out.push(u.into());
                replaced = true;
                break;
            }
        }
        if !replaced {
            out.push(w.into());
        }
    }
    out.join(" ")
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;
    use std::sync::OnceLock;

    #[test]
    fn folds_case_and_diacritics() {
        assert_eq!(normalize("Zoë"), "zoe");
        assert_eq!(normalize("ZOË"), "zoe");
        assert_eq!(normalize("Ångström"), "angstrom");
        assert_eq!(normalize("Łukasz"), "lukasz");
        assert_eq!(normalize("straße"), "strasse");
        assert_eq!(normalize("STRAẞE"), "strasse");
        assert_eq!(normalize("Søren Ærø Œuvre"), "soren aero oeuvre");
        assert_eq!(normalize("Þór Ðuro Đoković"), "thor duro dokovic");
        assert_eq!(normalize("İstanbul Işık"), "istanbul isik");
        assert_eq!(normalize("ΟΔΥΣΣΕΑΣ"), normalize("οδυσσεασ"));
    }

    #[test]
    fn fullwidth_and_compatibility() {
        assert_eq!(normalize("ｆｕｌｌwidth"), "fullwidth");
        assert_eq!(normalize("ﬁnal"), "final");
        assert_eq!(normalize("１００ｍ"), "100 m");
    }

    #[test]
    fn apostrophes_and_punctuation() {
        assert_eq!(
            normalize("Who won the women's 100m?"),
            "who won the womens 100 m"
        );
        assert_eq!(normalize("O'Dara"), "odara");
        assert_eq!(normalize("O’Dara"), "odara");
        assert_eq!(normalize("Smith-Jones, J."), "smith jones j");
        assert_eq!(normalize("col·legi"), "collegi");
        assert_eq!(normalize("coŀlegi"), "collegi");
        assert_eq!(normalize("  lots \t of\n space  "), "lots of space");
        assert_eq!(normalize("!!!"), "");
    }

    #[test]
    fn digit_separators() {
        assert_eq!(normalize("1:59.32"), "1:59.32");
        assert_eq!(normalize("won in 10.12."), "won in 10.12");
        assert_eq!(normalize("1,234 votes"), "1234 votes");
        assert_eq!(normalize("1,234,567"), "1234567");
        assert_eq!(normalize("1,5"), "1,5");
        assert_eq!(normalize("3, 4"), "3 4");
        assert_eq!(normalize("10,000m"), "10000 m");
    }

    #[test]
    fn distances() {
        assert_eq!(normalize("one hundred meters"), "100 m");
        assert_eq!(normalize("100 metres"), "100 m");
        assert_eq!(normalize("100 meters"), "100 m");
        assert_eq!(normalize("100-metre hurdles"), "100 m hurdles");
        assert_eq!(normalize("fifteen hundred metres"), "1500 m");
        assert_eq!(normalize("two hundred and fifty metres"), "250 m");
        assert_eq!(normalize("twenty-five kilometres walk"), "25 km walk");
        assert_eq!(normalize("ten thousand metres"), "10000 m");
        assert_eq!(normalize("one thousand five hundred m"), "1500 m");
        assert_eq!(normalize("5km"), "5 km");
        assert_eq!(normalize("1.5 Kilometers"), "1.5 km");
        assert_eq!(normalize("the second one"), "the second one");
        assert_eq!(normalize("top three"), "top three");
        assert_eq!(normalize("top three 100m"), "top three 100 m");
        assert_eq!(normalize("metres"), "metres");
        assert_eq!(normalize("one two metres"), "one 2 m");
        assert_eq!(normalize("one and metres"), "one and metres");
        assert_eq!(normalize("100mph"), "100mph");
    }

    #[test]
    fn tokens_split_on_spaces() {
        assert_eq!(
            tokens("who won the 100 m"),
            ["who", "won", "the", "100", "m"]
        );
        assert!(tokens("").is_empty());
    }

    #[test]
    fn every_single_code_point_is_idempotent() {
        // Cheap exhaustive check over all scalar values, with letter context
        // on both sides so casing and composition have neighbours.
        for cp in 0..=0x10FFFFu32 {
            let Some(c) = char::from_u32(cp) else {
                continue;
            };
            let s = format!("a{c}b 1{c}2");
            let once = normalize(&s);
            assert_eq!(normalize(&once), once, "U+{cp:04X}");
        }
    }

    /// Source strings and their expected NFKC, from Unicode
    /// NormalizationTest.txt (Unicode Character Database), as shipped by
    /// Debian's unicode-data package. Read once for all tests that use it.
    fn normalization_cases() -> &'static [(String, String)] {
        static CASES: OnceLock<Vec<(String, String)>> = OnceLock::new();
        CASES.get_or_init(|| {
            let text = read_normalization_test();
            let decode = |field: &str| -> String {
                field
                    .split_whitespace()
                    .map(|h| {
                        let cp = u32::from_str_radix(h, 16).expect("hex code point");
                        char::from_u32(cp).expect("scalar value")
                    })
                    .collect()
            };
            let mut cases = Vec::new();
            for line in text.lines() {
                let line = line.split('#').next().unwrap_or("").trim();
                if line.is_empty() || line.starts_with('@') {
                    continue;
                }
                let cols: Vec<&str> = line.split(';').collect();
                assert!(cols.len() >= 5, "malformed line: {line}");
                cases.push((decode(cols[0]), decode(cols[3])));
            }
            cases
        })
    }

    fn read_normalization_test() -> String {
        const TXT: &str = "/usr/share/unicode/NormalizationTest.txt";
        const BZ2: &str = "/usr/share/unicode/NormalizationTest.txt.bz2";
        if let Ok(text) = std::fs::read_to_string(TXT) {
            return text;
        }
        if std::path::Path::new(BZ2).exists() {
            let out = std::process::Command::new("bzcat")
                .arg(BZ2)
                .output()
                .expect("running bzcat to read NormalizationTest.txt.bz2");
            assert!(out.status.success(), "bzcat failed on {BZ2}");
            return String::from_utf8(out.stdout).expect("NormalizationTest.txt is UTF-8");
        }
        panic!(
            "{TXT}(.bz2) not found: install Debian's unicode-data package \
             (apt-get install -y unicode-data)"
        );
    }

    #[test]
    fn nfkc_matches_unicode_normalization_test() {
        let cases = normalization_cases();
        assert!(
            cases.len() > 10_000,
            "suspiciously few cases: {}",
            cases.len()
        );
        for (source, expected) in cases {
            assert_eq!(&nfkc(source), expected, "source {source:?}");
        }
    }

    #[test]
    fn normalize_is_idempotent_on_unicode_normalization_test() {
        for (source, expected) in normalization_cases() {
            for s in [source, expected] {
                let once = normalize(s);
                assert_eq!(normalize(&once), once, "source {s:?}");
            }
            // Equivalent inputs must land on the same canonical form.
            assert_eq!(normalize(source), normalize(expected));
        }
    }

    proptest! {
        #![proptest_config(ProptestConfig::with_cases(2000))]

        #[test]
        fn idempotent_any_text(s in any::<String>()) {
            let once = normalize(&s);
            prop_assert_eq!(normalize(&once), once);
        }

        #[test]
        fn idempotent_sporty_text(
            s in "([A-Za-zÀ-ÿŁłßØæ0-9 .,:'’`\\-]|one|two|hundred|thousand|and|fifty|metres|m|km|meters){0,24}"
        ) {
            let once = normalize(&s);
            prop_assert_eq!(normalize(&once), once.clone());
            prop_assert!(!once.starts_with(' ') && !once.ends_with(' ') && !once.contains("  "));
        }
    }
}
