//! Approximate matching of reader text against known names.
//!
//! Readers misspell and mis-hear names ("zoey marten" for "Zoë Martin",
//! "kathryn" for "Catherine"). This module holds the string-similarity
//! primitives the project uses, American Soundex, and [`FuzzyIndex`], which
//! finds the closest known names to a short query without scanning every
//! name.
//!
//! All inputs are expected to be in the form produced by
//! [`crate::understand::normalize::normalize`]; nothing here folds case or accents.

use std::cell::RefCell;
use std::collections::HashMap;
use std::hash::{BuildHasherDefault, Hasher};

/// Jaro–Winkler similarity in `[0, 1]` (prefix scale 0.1, prefix of at most
/// four characters, boost applied above a Jaro score of 0.7).
pub fn jaro_winkler(a: &str, b: &str) -> f64 {
    strsim::jaro_winkler(a, b)
}

/// Levenshtein edit distance (insertions, deletions, substitutions), in
/// characters.
pub fn levenshtein(a: &str, b: &str) -> usize {
    strsim::levenshtein(a, b)
}

/// Unrestricted Damerau–Levenshtein distance: like [`levenshtein`] plus
/// transpositions of adjacent characters, where a substring may be edited
/// more than once.
pub fn damerau(a: &str, b: &str) -> usize {
    strsim::damerau_levenshtein(a, b)
}

/// Optimal string alignment distance: like [`damerau`] but no substring may
/// be edited more than once, so it can exceed the true Damerau distance.
pub fn osa(a: &str, b: &str) -> usize {
    strsim::osa_distance(a, b)
}

/// Soundex digit for a letter; `None` for vowels, `y`, `h`, `w` and anything
/// that is not an ASCII letter.
fn soundex_digit(c: u8) -> Option<u8> {
    match c {
        b'b' | b'f' | b'p' | b'v' => Some(b'1'),
        b'c' | b'g' | b'j' | b'k' | b'q' | b's' | b'x' | b'z' => Some(b'2'),
        b'd' | b't' => Some(b'3'),
        b'l' => Some(b'4'),
        b'm' | b'n' => Some(b'5'),
        b'r' => Some(b'6'),
        _ => None,
    }
}

/// American Soundex code of `word`: an upper-case letter and three digits
/// ("Washington" → `W252`), or an empty string if `word` has no ASCII
/// letter.
///
/// Follows the U.S. National Archives' rules: letters with the same code
/// that are adjacent, or separated only by `h` or `w`, are coded once
/// (including the first letter); a vowel (or `y`) between them makes them
/// coded twice. Characters other than ASCII letters are ignored.
pub fn soundex(word: &str) -> String {
    let mut letters = word
        .bytes()
        .filter(u8::is_ascii_alphabetic)
        .map(|b| b.to_ascii_lowercase());
    let Some(first) = letters.next() else {
        return String::new();
    };
    let mut code = vec![first.to_ascii_uppercase()];
    // Code of the last letter that was not h/w; vowels reset it so a
    // repeated code after a vowel is written again.
    let mut prev = soundex_digit(first);
    for c in letters {
        if code.len() == 4 {
            break;
        }
        if c == b'h' || c == b'w' {
            continue;
        }
        let d = soundex_digit(c);
        if let Some(digit) = d {
            if d != prev {
                code.push(digit);
            }
        }
        prev = d;
    }
    code.resize(4, b'0');
    String::from_utf8(code).expect("soundex output is ASCII")
}

/// Phonetic key used by [`FuzzyIndex`]: Soundex with its first letter
/// replaced by that letter's sound class, packed into a `u32` (0 = none).
///
/// Plain Soundex keeps the first letter, so "catherine" (C365) and
/// "kathryn" (K365) never meet; classing the first letter the way Soundex
/// classes the others (c/k → 2, vowels/h/w/y → 0) lets them.
pub(crate) fn sound_key(word: &str) -> u32 {
    let code = soundex(word);
    let mut bytes: [u8; 4] = match code.as_bytes().try_into() {
        Ok(b) => b,
        Err(_) => return 0,
    };
    bytes[0] = soundex_digit(bytes[0].to_ascii_lowercase()).unwrap_or(b'0');
    u32::from_be_bytes(bytes)
}

/// A fast, non-cryptographic hasher for the index's integer keys. Keys come
/// from the dataset and queries only read the maps, so hash flooding is not
/// a concern, and SipHash would dominate a lookup's cost.
#[derive(Default)]
struct IntHasher(u64);

impl Hasher for IntHasher {
    fn finish(&self) -> u64 {
        self.0
    }
    fn write(&mut self, bytes: &[u8]) {
        for &b in bytes {
            self.write_u64(u64::from(b));
        }
    }
    fn write_u32(&mut self, n: u32) {
        self.write_u64(u64::from(n));
    }
    fn write_u64(&mut self, n: u64) {
        self.0 = (self.0.rotate_left(5) ^ n).wrapping_mul(0x51_7c_c1_b7_27_22_0a_95);
    }
}

type IntMap<K, V> = HashMap<K, V, BuildHasherDefault<IntHasher>>;

thread_local! {
    /// Shared-gram counter per term index, reused by every lookup on this
    /// thread (all zero between lookups): counting into a flat array is
    /// several times faster than a hash map, and reusing it avoids clearing
    /// one entry per indexed term on every lookup.
    static COUNTS: RefCell<Vec<u16>> = const { RefCell::new(Vec::new()) };
}

/// How many candidates (by shared grams) are re-ranked with the full score.
/// Enough to survive a few edits among many similar names, few enough that
/// re-ranking stays a few microseconds.
const CANDIDATES: usize = 32;

/// A sound-key match counts as this many shared trigrams when choosing
/// candidates, so a mis-hearing with few common letters still competes.
const SOUND_WEIGHT: u16 = 2;

/// Posting lists longer than this are skipped once some candidates exist:
/// on very large indexes a gram such as " ma" is shared by thousands of
/// names and adds cost without telling them apart.
const LONG_POSTING: usize = 4096;

/// Largest value below 1.0: the score of anything but the exact term.
const BELOW_ONE: f64 = 1.0 - f64::EPSILON;

/// One indexed (distinct) term.
struct Term {
    text: String,
    /// Caller ids carried by this term, sorted and distinct.
    ids: Vec<u32>,
    /// Byte ranges of the words in `text`.
    words: Vec<(usize, usize)>,
    /// Sound key of each word (0 if it has none).
    keys: Vec<u32>,
    /// Length in characters.
    chars: usize,
}

/// One result of [`FuzzyIndex::lookup`].
#[derive(Debug, Clone, PartialEq)]
pub struct FuzzyHit {
    /// The caller's id.
    pub id: u32,
    /// Which indexed term matched; see [`FuzzyIndex::term`].
    pub term_index: usize,
    /// Similarity in `[0, 1]`; exactly 1.0 only for an identical term.
    pub score: f64,
}

/// Approximate-match index over normalized names, built once.
///
/// Candidates come from an inverted index of padded character trigrams and
/// of per-word sound keys, so a lookup touches only names that share
/// something with the query; the best few dozen are then re-ranked with
/// [`FuzzyIndex::lookup`]'s score.
pub struct FuzzyIndex {
    terms: Vec<Term>,
    exact: HashMap<String, u32>,
    grams: IntMap<u64, Vec<u32>>,
    sounds: IntMap<u32, Vec<u32>>,
}

/// Distinct padded trigrams of `text`, each packed into a `u64` (three
/// 21-bit scalar values). Two leading spaces and one trailing space make the
/// first letters count most, as misspellings rarely start a name.
fn trigrams(text: &str, out: &mut Vec<u64>) {
    out.clear();
    let mut window = [u64::from(b' '); 3];
    let push = |c: char, window: &mut [u64; 3], out: &mut Vec<u64>| {
        window[0] = window[1];
        window[1] = window[2];
        window[2] = u64::from(u32::from(c));
        out.push((window[0] << 42) | (window[1] << 21) | window[2]);
    };
    for c in text.chars() {
        push(c, &mut window, out);
    }
    push(' ', &mut window, out);
    out.sort_unstable();
    out.dedup();
}

fn word_ranges(text: &str) -> Vec<(usize, usize)> {
    let mut ranges = Vec::new();
    let mut start = None;
    for (i, c) in text.char_indices() {
        match (c.is_whitespace(), start) {
            (true, Some(s)) => {
                ranges.push((s, i));
                start = None;
            }
            (false, None) => start = Some(i),
            _ => {}
        }
    }
    if let Some(s) = start {
        ranges.push((s, text.len()));
    }
    ranges
}

/// Longest ASCII string handled by the allocation-free fast paths below;
/// longer or non-ASCII strings fall back to `strsim`.
const FAST_MAX: usize = 64;

/// Jaro–Winkler, identical in result to [`jaro_winkler`], without heap
/// allocation for short ASCII strings (the common case for names). Scoring
/// runs a few hundred of these per lookup, so the allocations would
/// dominate.
fn fast_jaro_winkler(a: &str, b: &str) -> f64 {
    let (a, b) = (a.as_bytes(), b.as_bytes());
    if a.len() > FAST_MAX || b.len() > FAST_MAX || !a.is_ascii() || !b.is_ascii() {
        // The slices came from &str, and the fallback needs them back.
        return jaro_winkler(
            std::str::from_utf8(a).unwrap_or_default(),
            std::str::from_utf8(b).unwrap_or_default(),
        );
    }
    if a.is_empty() && b.is_empty() {
        return 1.0;
    }
    if a.is_empty() || b.is_empty() {
        return 0.0;
    }
    let range = (a.len().max(b.len()) / 2).saturating_sub(1);
    let (mut a_flags, mut b_flags) = (0u64, 0u64);
    let mut matches = 0usize;
    {
        // Bit-parallel matching: positions of each byte in `b` as a bit set,
        // so the first unused match inside the window is a mask and a
        // trailing-zero count instead of a scan.
        let mut positions = [0u64; 128];
        for (j, &cb) in b.iter().enumerate() {
            positions[usize::from(cb)] |= 1 << j;
        }
        let below = |n: usize| if n >= 64 { u64::MAX } else { (1u64 << n) - 1 };
        for (i, &ca) in a.iter().enumerate() {
            let lo = i.saturating_sub(range);
            let hi = (i + range + 1).min(b.len());
            let free = positions[usize::from(ca)] & !b_flags & below(hi) & !below(lo);
            if free != 0 {
                b_flags |= 1 << free.trailing_zeros();
                a_flags |= 1 << i;
                matches += 1;
            }
        }
    }
    if matches == 0 {
        return 0.0;
    }
    // Walk the matched characters of both strings in order; each mismatch
    // is half a transposition.
    let mut half = 0usize;
    let mut rest = b_flags;
    for (i, &ca) in a.iter().enumerate() {
        if a_flags & (1 << i) != 0 {
            let j = rest.trailing_zeros() as usize;
            rest &= rest - 1;
            if ca != b[j] {
                half += 1;
            }
        }
    }
    let m = matches as f64;
    let jaro = (m / a.len() as f64 + m / b.len() as f64 + (matches - half / 2) as f64 / m) / 3.0;
    if jaro > 0.7 {
        let prefix = a.iter().zip(b).take(4).take_while(|(x, y)| x == y).count();
        jaro + 0.1 * prefix as f64 * (1.0 - jaro)
    } else {
        jaro
    }
}

/// Optimal string alignment distance, identical in result to [`osa`],
/// without heap allocation for short ASCII strings.
fn fast_osa(a: &str, b: &str) -> usize {
    let (a, b) = (a.as_bytes(), b.as_bytes());
    if a.len() > FAST_MAX || b.len() > FAST_MAX || !a.is_ascii() || !b.is_ascii() {
        return osa(
            std::str::from_utf8(a).unwrap_or_default(),
            std::str::from_utf8(b).unwrap_or_default(),
        );
    }
    // Three rolling rows of the dynamic-programming table.
    let mut prev2 = [0u8; FAST_MAX + 1];
    let mut prev: [u8; FAST_MAX + 1] = std::array::from_fn(|j| j as u8);
    let mut cur = [0u8; FAST_MAX + 1];
    for i in 1..=a.len() {
        cur[0] = i as u8;
        for j in 1..=b.len() {
            let cost = u8::from(a[i - 1] != b[j - 1]);
            let mut d = (prev[j] + 1).min(cur[j - 1] + 1).min(prev[j - 1] + cost);
            if i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1] {
                d = d.min(prev2[j - 2] + 1);
            }
            cur[j] = d;
        }
        std::mem::swap(&mut prev2, &mut prev);
        std::mem::swap(&mut prev, &mut cur);
    }
    usize::from(prev[b.len()])
}

/// Bag distance: the larger of "characters of `a` not in `b`" and the
/// reverse, counted as multisets. Each edit (including a transposition)
/// changes it by at most one, so it is a lower bound on [`osa`] and costs
/// only a linear pass. Non-ASCII strings get the trivial bound of the length
/// difference.
fn bag_distance(a: &str, b: &str) -> usize {
    if !a.is_ascii() || !b.is_ascii() {
        return a.chars().count().abs_diff(b.chars().count());
    }
    let mut counts = [0i32; 128];
    for &c in a.as_bytes() {
        counts[usize::from(c)] += 1;
    }
    for &c in b.as_bytes() {
        counts[usize::from(c)] -= 1;
    }
    let (mut extra_a, mut extra_b) = (0usize, 0usize);
    for c in counts {
        if c > 0 {
            extra_a += c as usize;
        } else {
            extra_b += c.unsigned_abs() as usize;
        }
    }
    extra_a.max(extra_b)
}

/// Most words per side that the word-aligned score looks at; names never
/// come close, and the cap keeps the per-word maxima on the stack.
const MAX_WORDS: usize = 16;

/// Similarity of two words: Jaro–Winkler, moved halfway towards 1.0 when
/// their sound keys agree (a mis-hearing is as good as a near-spelling).
fn word_similarity(a: &str, a_key: u32, b: &str, b_key: u32) -> f64 {
    let jw = fast_jaro_winkler(a, b);
    if a_key != 0 && a_key == b_key {
        jw + 0.5 * (1.0 - jw)
    } else {
        jw
    }
}

/// Word-aligned score: the mean of "each query word's best match among the
/// term's words" and "each term word's best match among the query's words".
fn aligned(query: &Query<'_>, term: &Term) -> f64 {
    let q_n = query.words.len().min(MAX_WORDS);
    let t_n = term.words.len().min(MAX_WORDS);
    if q_n == 0 || t_n == 0 {
        return 0.0;
    }
    let mut q_best = [0.0f64; MAX_WORDS];
    let mut t_best = [0.0f64; MAX_WORDS];
    for (qi, (&qw, &qk)) in query.words.iter().zip(&query.keys).take(q_n).enumerate() {
        for (ti, (&(s, e), &tk)) in term.words.iter().zip(&term.keys).take(t_n).enumerate() {
            let sim = word_similarity(qw, qk, &term.text[s..e], tk);
            q_best[qi] = q_best[qi].max(sim);
            t_best[ti] = t_best[ti].max(sim);
        }
    }
    let q_mean = q_best[..q_n].iter().sum::<f64>() / q_n as f64;
    let t_mean = t_best[..t_n].iter().sum::<f64>() / t_n as f64;
    0.5 * (q_mean + t_mean)
}

/// How much whole-string Jaro–Winkler is discounted per character of length
/// difference (see [`score`]).
const LENGTH_PENALTY: f64 = 0.03;

/// Score of `query` against `term`, in `[0, 1]`.
///
/// Components:
/// - `whole`: Jaro–Winkler on the two full strings, less 0.03 per character
///   of length difference: a short query against a long name ("final" /
///   "fiona lindqvist") scores high on plain Jaro–Winkler just for sharing
///   a prefix.
/// - `word`: word-aligned score, the mean of "each query word's best match
///   among the term's words" and the same from the term's side, so word
///   order does not matter and an extra or missing word costs in
///   proportion; words whose sound keys agree count as half-way to
///   identical.
/// - `edit`: `1 - osa / longer length`, which Jaro–Winkler lacks: its greedy
///   matching can turn one substituted letter into several transpositions
///   ("cecfefae" / "cjcfefae" is only 0.80).
///
/// score = max((whole + word) / 2, whole, edit).
/// The blend rewards agreement at both levels; the two whole-string terms
/// keep a single typo or a merged/split word ("vander berg" / "vanderberg")
/// from being dragged down by a broken word alignment.
///
/// Identical strings score exactly 1.0; anything else is capped just below,
/// so an exact term always outranks every other term.
fn score(query: &Query<'_>, term: &Term) -> f64 {
    if query.text == term.text {
        return 1.0;
    }
    let jw = fast_jaro_winkler(query.text, &term.text);
    let word = aligned(query, term);
    let len_diff = term.chars.abs_diff(query.chars);
    let whole = (jw - LENGTH_PENALTY * len_diff as f64).max(0.0);
    let best = (0.5 * (whole + word)).max(whole);
    // The edit score cannot beat 1 - bag distance / longer; skip the
    // quadratic distance when that bound cannot raise the score.
    let longer = term.chars.max(query.chars);
    let edit_bound = (longer - bag_distance(query.text, &term.text)) as f64 / longer as f64;
    let edit = if edit_bound > best {
        let d = fast_osa(query.text, &term.text).min(longer);
        (longer - d) as f64 / longer as f64
    } else {
        0.0
    };
    best.max(edit).clamp(0.0, BELOW_ONE)
}

/// A query prepared once for scoring against every candidate.
struct Query<'a> {
    text: &'a str,
    chars: usize,
    words: Vec<&'a str>,
    keys: Vec<u32>,
}

impl<'a> Query<'a> {
    fn new(text: &'a str) -> Self {
        let words: Vec<&str> = text.split_whitespace().collect();
        let keys = words.iter().map(|w| sound_key(w)).collect();
        Query {
            text,
            chars: text.chars().count(),
            words,
            keys,
        }
    }
}

impl FuzzyIndex {
    /// Builds the index from `(normalized term, caller id)` pairs.
    ///
    /// Several terms may share an id (aliases), and one term may carry
    /// several ids (namesakes). Duplicate pairs are harmless. Empty terms are
    /// ignored.
    pub fn new(terms: impl IntoIterator<Item = (String, u32)>) -> FuzzyIndex {
        let mut index = FuzzyIndex {
            terms: Vec::new(),
            exact: HashMap::new(),
            grams: IntMap::default(),
            sounds: IntMap::default(),
        };
        for (text, id) in terms {
            if text.trim().is_empty() {
                continue;
            }
            if let Some(&t) = index.exact.get(&text) {
                index.terms[t as usize].ids.push(id);
                continue;
            }
            let t = u32::try_from(index.terms.len()).expect("fewer than 2^32 terms");
            let words = word_ranges(&text);
            let keys = words.iter().map(|&(s, e)| sound_key(&text[s..e])).collect();
            index.exact.insert(text.clone(), t);
            index.terms.push(Term {
                chars: text.chars().count(),
                text,
                ids: vec![id],
                words,
                keys,
            });
        }

        let mut grams = Vec::new();
        for (t, term) in index.terms.iter_mut().enumerate() {
            term.ids.sort_unstable();
            term.ids.dedup();
            let t = t as u32;
            trigrams(&term.text, &mut grams);
            for &g in &grams {
                index.grams.entry(g).or_default().push(t);
            }
            let mut keys: Vec<u32> = term.keys.iter().copied().filter(|&k| k != 0).collect();
            keys.sort_unstable();
            keys.dedup();
            for k in keys {
                index.sounds.entry(k).or_default().push(t);
            }
        }
        index.grams.shrink_to_fit();
        index.sounds.shrink_to_fit();
        index
    }

    /// Number of distinct terms indexed.
    pub fn len(&self) -> usize {
        self.terms.len()
    }

    /// Whether no terms are indexed.
    pub fn is_empty(&self) -> bool {
        self.terms.is_empty()
    }

    /// Text of the term a [`FuzzyHit::term_index`] refers to.
    ///
    /// Panics if `term_index` did not come from this index.
    pub fn term(&self, term_index: usize) -> &str {
        &self.terms[term_index].text
    }

    /// Up to `limit` ids whose terms best match `query` with a score of at
    /// least `min_score`, best first (score descending, then id ascending).
    ///
    /// `query` must be normalized the same way as the terms. Each id appears
    /// at most once, with its best-matching term. Only terms sharing a
    /// trigram or a word sound key with the query can be found, and only the
    /// few dozen that share the most are scored.
    pub fn lookup(&self, query: &str, min_score: f64, limit: usize) -> Vec<FuzzyHit> {
        if limit == 0 || query.trim().is_empty() || self.terms.is_empty() {
            return Vec::new();
        }
        let prepared = Query::new(query);

        // Shared-gram counts per term. Rare grams first, so that the long
        // posting lists skipped on huge indexes are the least telling ones.
        let mut grams = Vec::new();
        trigrams(query, &mut grams);
        let mut postings: Vec<&[u32]> = grams
            .iter()
            .filter_map(|g| self.grams.get(g).map(Vec::as_slice))
            .collect();
        postings.sort_unstable_by_key(|p| p.len());
        let mut keys: Vec<u32> = prepared.keys.iter().copied().filter(|&k| k != 0).collect();
        keys.sort_unstable();
        keys.dedup();
        let sounds = keys.iter().filter_map(|k| self.sounds.get(k));

        let mut counted: Vec<(u32, u16)> = COUNTS.with_borrow_mut(|counts| {
            if counts.len() < self.terms.len() {
                counts.resize(self.terms.len(), 0);
            }
            let mut touched: Vec<u32> = Vec::new();
            let weighted = postings
                .into_iter()
                .map(|p| (p, 1))
                .chain(sounds.map(|p| (p.as_slice(), SOUND_WEIGHT)));
            for (list, weight) in weighted {
                if list.len() > LONG_POSTING && !touched.is_empty() {
                    continue;
                }
                for &t in list {
                    let c = &mut counts[t as usize];
                    if *c == 0 {
                        touched.push(t);
                    }
                    *c = c.saturating_add(weight);
                }
            }
            // Read out and leave the scratch all-zero for the next lookup.
            touched
                .into_iter()
                .map(|t| (t, std::mem::take(&mut counts[t as usize])))
                .collect()
        });
        // The exact term always competes, however many longer terms contain
        // all of the query's grams.
        if let Some(&t) = self.exact.get(query) {
            counted.push((t, u16::MAX));
        }

        // Keep the best candidates: most shared grams, then closest length,
        // then lowest index. Packed into one u64 (smaller is better) so the
        // selection compares plain integers.
        let query_chars = prepared.chars;
        let mut candidates: Vec<u64> = counted
            .into_iter()
            .map(|(t, c)| {
                let len_diff = self.terms[t as usize].chars.abs_diff(query_chars);
                (u64::from(u16::MAX - c) << 48)
                    | ((len_diff.min(0xFFFF) as u64) << 32)
                    | u64::from(t)
            })
            .collect();
        if candidates.len() > CANDIDATES {
            candidates.select_nth_unstable(CANDIDATES - 1);
            candidates.truncate(CANDIDATES);
        }

        let mut hits: Vec<FuzzyHit> = Vec::new();
        for &packed in &candidates {
            let t = packed as u32 as usize;
            let term = &self.terms[t];
            let s = score(&prepared, term);
            if s >= min_score {
                hits.extend(term.ids.iter().map(|&id| FuzzyHit {
                    id,
                    term_index: t,
                    score: s,
                }));
            }
        }
        // One hit per id: its best term (lowest term index on ties).
        hits.sort_unstable_by(|a, b| {
            a.id.cmp(&b.id)
                .then(b.score.total_cmp(&a.score))
                .then(a.term_index.cmp(&b.term_index))
        });
        hits.dedup_by_key(|h| h.id);
        hits.sort_unstable_by(|a, b| b.score.total_cmp(&a.score).then(a.id.cmp(&b.id)));
        hits.truncate(limit);
        hits
    }
}

impl std::fmt::Debug for FuzzyIndex {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("FuzzyIndex")
            .field("terms", &self.len())
            .finish_non_exhaustive()
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    fn index(names: &[&str]) -> FuzzyIndex {
        FuzzyIndex::new(
            names
                .iter()
                .enumerate()
                .map(|(i, n)| (n.to_string(), i as u32)),
        )
    }

    #[test]
    fn jaro_winkler_published_values() {
        // Winkler, W. E. (1990), "String Comparator Metrics and Enhanced
        // Decision Rules in the Fellegi-Sunter Model of Record Linkage",
        // Table 5 (p = 0.1, common prefix of at most 4).
        let cases = [
            ("MARTHA", "MARHTA", 0.961111),
            ("DWAYNE", "DUANE", 0.840000),
            ("DIXON", "DICKSONX", 0.813333),
            ("JONES", "JOHNSON", 0.832381),
        ];
        for (a, b, expected) in cases {
            let got = jaro_winkler(a, b);
            assert!((got - expected).abs() < 1e-6, "{a}/{b}: {got}");
        }
    }

    #[test]
    fn edit_distances() {
        // Levenshtein (1966), the classic kitten/sitting example.
        assert_eq!(levenshtein("kitten", "sitting"), 3);
        // Common textbook example: OSA cannot edit the transposed pair
        // again, full Damerau–Levenshtein can.
        assert_eq!(osa("ca", "abc"), 3);
        assert_eq!(damerau("ca", "abc"), 2);
    }

    #[test]
    fn soundex_national_archives_examples() {
        // U.S. National Archives, "The Soundex Indexing System".
        let cases = [
            ("washington", "W252"),
            ("lee", "L000"),
            ("gutierrez", "G362"),
            ("pfister", "P236"),
            ("jackson", "J250"),
            ("tymczak", "T522"),
            ("ashcraft", "A261"),
        ];
        for (word, code) in cases {
            assert_eq!(soundex(word), code, "{word}");
        }
        assert_eq!(soundex(""), "");
        assert_eq!(soundex("123 !"), "");
        assert_eq!(soundex("o'hara"), soundex("ohara"));
    }

    #[test]
    fn sound_key_classes_first_letter() {
        assert_eq!(sound_key("catherine"), sound_key("kathryn"));
        assert_ne!(sound_key("catherine"), sound_key("martin"));
        assert_eq!(sound_key("123"), 0);
    }

    #[test]
    fn finds_misspellings_and_mishearings() {
        let idx = index(&[
            "zoe marten",
            "jonsson",
            "catherine wu",
            "wanda kessel",
            "hu li",
            "marta zoellner",
        ]);
        let hits = idx.lookup("zoey martin", 0.8, 3);
        assert_eq!(idx.term(hits[0].term_index), "zoe marten", "{hits:?}");
        let hits = idx.lookup("jonsen", 0.8, 3);
        assert_eq!(idx.term(hits[0].term_index), "jonsson", "{hits:?}");
        let hits = idx.lookup("kathryn wu", 0.8, 3);
        assert_eq!(idx.term(hits[0].term_index), "catherine wu", "{hits:?}");
        let exact = idx.lookup("hu li", 0.0, 10);
        assert_eq!((exact[0].id, exact[0].score), (4, 1.0));
        assert!(exact[1..].iter().all(|h| h.score < 1.0));
    }

    #[test]
    fn unrelated_words_score_low() {
        let idx = index(&["wanda kessel", "hu li", "zoe marten", "fiona lindqvist"]);
        for word in ["won", "who", "final", "the", "women"] {
            let hits = idx.lookup(word, 0.0, 10);
            for h in &hits {
                assert!(
                    h.score < 0.8,
                    "{word} vs {}: {}",
                    idx.term(h.term_index),
                    h.score
                );
            }
        }
    }

    #[test]
    fn ids_and_aliases() {
        let idx = FuzzyIndex::new([
            ("zoe ardent".to_string(), 7),
            ("ardent".to_string(), 7),
            ("zoe ardent".to_string(), 3),
            ("zoe ardent".to_string(), 3),
            (String::new(), 9),
        ]);
        assert_eq!(idx.len(), 2);
        let hits = idx.lookup("zoe ardent", 0.5, 10);
        let ids: Vec<(u32, f64)> = hits.iter().map(|h| (h.id, h.score)).collect();
        assert_eq!(ids, [(3, 1.0), (7, 1.0)]);
        assert!(idx.lookup("zoe ardent", 0.5, 0).is_empty());
        assert!(idx.lookup("", 0.0, 10).is_empty());
        assert!(FuzzyIndex::new([]).lookup("x", 0.0, 10).is_empty());
    }

    #[test]
    fn exact_term_survives_many_supersets() {
        let mut names: Vec<String> = (0..200).map(|i| format!("li {i}")).collect();
        names.push("li".to_string());
        let idx = FuzzyIndex::new(names.into_iter().zip(0..));
        let hits = idx.lookup("li", 0.0, 1);
        assert_eq!((hits[0].id, hits[0].score), (200, 1.0));
    }

    fn term_strategy() -> impl Strategy<Value = String> {
        "[a-z]{2,8}( [a-z]{2,8}){0,2}"
    }

    proptest! {
        #![proptest_config(ProptestConfig::with_cases(300))]

        #[test]
        fn exact_term_ranks_first(
            terms in prop::collection::vec(term_strategy(), 1..60),
            pick in any::<prop::sample::Index>(),
        ) {
            let idx = FuzzyIndex::new(terms.iter().cloned().zip(0..));
            let i = pick.index(terms.len());
            let me = &terms[i];
            let hits = idx.lookup(me, 0.0, terms.len());
            prop_assert!(!hits.is_empty());
            prop_assert_eq!(hits[0].score, 1.0);
            let mine = hits.iter().position(|h| h.id == i as u32);
            prop_assert!(mine.is_some(), "own id missing");
            for h in &hits[..=mine.unwrap()] {
                prop_assert_eq!(h.score, 1.0);
                prop_assert_eq!(idx.term(h.term_index), me.as_str());
            }
            for h in &hits {
                prop_assert!((0.0..=1.0).contains(&h.score));
                prop_assert!(h.score < 1.0 || idx.term(h.term_index) == me);
            }
        }

        #[test]
        fn fast_paths_match_strsim(a in "[a-e ]{0,70}", b in "[a-e ]{0,70}") {
            prop_assert_eq!(fast_jaro_winkler(&a, &b), jaro_winkler(&a, &b));
            prop_assert_eq!(fast_osa(&a, &b), osa(&a, &b));
        }

        #[test]
        fn bag_distance_bounds_osa(a in "[a-e ]{0,20}", b in "[a-e ]{0,20}") {
            prop_assert!(bag_distance(&a, &b) <= osa(&a, &b));
        }

        #[test]
        fn fast_paths_match_strsim_unicode(a in "[aeé ł]{0,12}", b in "[aeé ł]{0,12}") {
            prop_assert_eq!(fast_jaro_winkler(&a, &b), jaro_winkler(&a, &b));
            prop_assert_eq!(fast_osa(&a, &b), osa(&a, &b));
        }

        #[test]
        fn scores_within_unit_interval(
            terms in prop::collection::vec(term_strategy(), 1..30),
            query in "[a-z ]{0,20}",
        ) {
            let idx = FuzzyIndex::new(terms.into_iter().zip(0..));
            for h in idx.lookup(&query, 0.0, 100) {
                prop_assert!((0.0..=1.0).contains(&h.score), "{}", h.score);
            }
        }

        #[test]
        fn one_changed_character_still_found(
            terms in prop::collection::vec(term_strategy(), 1..60),
            pick in any::<prop::sample::Index>(),
            at in any::<prop::sample::Index>(),
            with in "[a-z ]",
        ) {
            let i = pick.index(terms.len());
            let original = &terms[i];
            prop_assume!(original.len() >= 5);
            let mut chars: Vec<char> = original.chars().collect();
            let at = at.index(chars.len());
            chars[at] = with.chars().next().unwrap();
            let query: String = chars.into_iter().collect();
            let idx = FuzzyIndex::new(terms.iter().cloned().zip(0..));
            let hits = idx.lookup(&query, 0.8, 60);
            prop_assert!(
                hits.iter().any(|h| idx.term(h.term_index) == original),
                "{:?} not found for {:?}: {:?}", original, query, hits
            );
        }
    }
}
