//! General English, built in: what every scenario's readers write whatever
//! the beat. Contractions and their usual misspellings ("who's", "whos",
//! "how'd"), texting short forms ("tmrw", "pls"), number words ("two
//! hundred", "a hundred"), ordinal words ("fifteenth", "twenty-first"),
//! the words that carry no content (articles, pronouns, auxiliaries,
//! prepositions, politeness) and where a question starts after a chatty
//! opening ("hi, quick one —", "my son was asking …").
//!
//! Everything here works on tokens that [`super::normalize`] produced:
//! lowercase, no apostrophes, no diacritics.

use super::normalize::{is_number_word, parse_number_words};

/// Contractions as they look once apostrophes are gone, and their common
/// misspellings, with what they stand for. "its", "were", "ill", "wed" and
/// "id" are words of their own and are left alone.
const CONTRACTIONS: &[(&str, &[&str])] = &[
    ("whos", &["who", "is"]),
    ("whose", &["whose"]),
    ("whats", &["what", "is"]),
    ("wats", &["what", "is"]),
    ("wots", &["what", "is"]),
    ("whatz", &["what", "is"]),
    ("hoos", &["who", "is"]),
    ("wheres", &["where", "is"]),
    ("whens", &["when", "is"]),
    ("hows", &["how", "is"]),
    ("whys", &["why", "is"]),
    ("whichs", &["which", "is"]),
    ("thats", &["that", "is"]),
    ("theres", &["there", "is"]),
    ("heres", &["here", "is"]),
    ("hes", &["he", "is"]),
    ("shes", &["she", "is"]),
    ("lets", &["let", "us"]),
    ("whod", &["who", "did"]),
    ("howd", &["how", "did"]),
    ("whered", &["where", "did"]),
    ("whatd", &["what", "did"]),
    ("whend", &["when", "did"]),
    ("whove", &["who", "have"]),
    ("whatre", &["what", "are"]),
    ("whore", &["who", "are"]),
    ("wherere", &["where", "are"]),
    ("howre", &["how", "are"]),
    ("whatll", &["what", "will"]),
    ("wholl", &["who", "will"]),
    ("whenll", &["when", "will"]),
    ("isnt", &["is", "not"]),
    ("arent", &["are", "not"]),
    ("wasnt", &["was", "not"]),
    ("werent", &["were", "not"]),
    ("hasnt", &["has", "not"]),
    ("havent", &["have", "not"]),
    ("hadnt", &["had", "not"]),
    ("didnt", &["did", "not"]),
    ("doesnt", &["does", "not"]),
    ("dont", &["do", "not"]),
    ("cant", &["can", "not"]),
    ("cannot", &["can", "not"]),
    ("couldnt", &["could", "not"]),
    ("wouldnt", &["would", "not"]),
    ("shouldnt", &["should", "not"]),
    ("wont", &["will", "not"]),
    ("aint", &["is", "not"]),
    ("im", &["i", "am"]),
    ("ive", &["i", "have"]),
    ("youre", &["you", "are"]),
    ("youve", &["you", "have"]),
    ("theyre", &["they", "are"]),
    ("theyve", &["they", "have"]),
    ("weve", &["we", "have"]),
    ("gonna", &["going", "to"]),
    ("wanna", &["want", "to"]),
    ("gimme", &["give", "me"]),
    ("lemme", &["let", "me"]),
    ("dunno", &["do", "not", "know"]),
];

/// Texting and chat short forms (common practice), as one normalised word
/// each, with what they stand for.
const SHORT_FORMS: &[(&str, &[&str])] = &[
    ("u", &["you"]),
    ("ur", &["your"]),
    ("r", &["are"]),
    ("y", &["why"]),
    ("wat", &["what"]),
    ("wot", &["what"]),
    ("wht", &["what"]),
    ("waht", &["what"]),
    ("whta", &["what"]),
    ("whn", &["when"]),
    ("wen", &["when"]),
    ("wher", &["where"]),
    ("whr", &["where"]),
    ("hw", &["how"]),
    ("hu", &["who"]),
    ("teh", &["the"]),
    ("da", &["the"]),
    ("pls", &["please"]),
    ("plz", &["please"]),
    ("plse", &["please"]),
    ("thx", &["thanks"]),
    ("thnx", &["thanks"]),
    ("thanx", &["thanks"]),
    ("ty", &["thanks"]),
    ("tmrw", &["tomorrow"]),
    ("tmr", &["tomorrow"]),
    ("tmw", &["tomorrow"]),
    ("tomoz", &["tomorrow"]),
    ("2moro", &["tomorrow"]),
    ("2morrow", &["tomorrow"]),
    ("2day", &["today"]),
    ("tdy", &["today"]),
    ("tonite", &["tonight"]),
    ("2nite", &["tonight"]),
    ("yday", &["yesterday"]),
    ("yest", &["yesterday"]),
    ("b4", &["before"]),
    ("bc", &["because"]),
    ("cuz", &["because"]),
    ("coz", &["because"]),
    ("btw", &["by", "the", "way"]),
    ("vs", &["versus"]),
    ("v", &["versus"]),
    ("rn", &["right", "now"]),
    ("atm", &["at", "the", "moment"]),
    ("asap", &["now"]),
    ("info", &["information"]),
    ("pts", &["points"]),
    ("pt", &["points"]),
    ("mins", &["minutes"]),
    ("min", &["minutes"]),
    ("hrs", &["hours"]),
    ("hr", &["hours"]),
    ("secs", &["seconds"]),
    ("sec", &["seconds"]),
];

/// Words that carry no content of their own: articles, pronouns,
/// auxiliaries, prepositions, conjunctions and everyday adverbs. A question
/// made only of these and names says nothing the service could miss.
const FUNCTION_WORDS: &[&str] = &[
    "a",
    "an",
    "the",
    "this",
    "that",
    "these",
    "those",
    "some",
    "any",
    "each",
    "every",
    "all",
    "both",
    "either",
    "neither",
    "no",
    "another",
    "other",
    "such",
    "i",
    "me",
    "my",
    "mine",
    "we",
    "us",
    "our",
    "ours",
    "you",
    "your",
    "yours",
    "he",
    "him",
    "his",
    "she",
    "her",
    "hers",
    "it",
    "its",
    "they",
    "them",
    "their",
    "theirs",
    "myself",
    "yourself",
    "himself",
    "herself",
    "itself",
    "ourselves",
    "themselves",
    "one",
    "ones",
    "someone",
    "somebody",
    "anyone",
    "anybody",
    "everyone",
    "everybody",
    "something",
    "anything",
    "everything",
    "nothing",
    "be",
    "am",
    "is",
    "are",
    "was",
    "were",
    "been",
    "being",
    "do",
    "does",
    "did",
    "doing",
    "done",
    "have",
    "has",
    "had",
    "having",
    "can",
    "could",
    "will",
    "would",
    "shall",
    "should",
    "may",
    "might",
    "must",
    "of",
    "in",
    "on",
    "at",
    "to",
    "for",
    "from",
    "by",
    "with",
    "about",
    "into",
    "onto",
    "over",
    "under",
    "up",
    "down",
    "out",
    "off",
    "as",
    "than",
    "then",
    "so",
    "and",
    "or",
    "but",
    "nor",
    "if",
    "because",
    "while",
    "though",
    "although",
    "also",
    "too",
    "very",
    "just",
    "only",
    "even",
    "still",
    "yet",
    "already",
    "really",
    "quite",
    "pretty",
    "rather",
    "again",
    "ever",
    "there",
    "here",
    "now",
    "then",
    "way",
    "get",
    "got",
    "gets",
    "getting",
    "let",
    "lets",
    "go",
    "going",
    "gone",
    "went",
    "come",
    "came",
    "make",
    "made",
    "say",
    "said",
    "see",
    "look",
    "looking",
    "know",
    "knows",
    "think",
    "thought",
    "guess",
    "reckon",
    "want",
    "wanted",
    "wants",
    "need",
    "needs",
    "like",
    "please",
    "kindly",
    "tell",
    "telling",
    "told",
    "give",
    "show",
    "find",
    "check",
    "let",
    "remind",
    "update",
    "info",
    "information",
    "details",
    "thing",
    "things",
    "stuff",
    "bit",
    "lot",
    "lots",
    "much",
    "many",
    "what",
    "who",
    "whom",
    "whose",
    "which",
    "when",
    "where",
    "why",
    "how",
    "whether",
    "versus",
    "against",
    "right",
    "exactly",
    "currently",
    "actually",
    "basically",
    "anyway",
    "well",
    "yes",
    "yeah",
    "yep",
    "no",
    "nope",
    "ok",
    "okay",
    "sure",
    "not",
];

/// Words of greeting, politeness and chat around a question ("hi, quick
/// one", "sorry to bother you", "I was wondering"): never the question.
const CHAT_WORDS: &[&str] = &[
    "hi",
    "hello",
    "hey",
    "hiya",
    "heya",
    "howdy",
    "yo",
    "morning",
    "evening",
    "afternoon",
    "greetings",
    "dear",
    "thanks",
    "thank",
    "cheers",
    "ta",
    "sorry",
    "excuse",
    "pardon",
    "oh",
    "ah",
    "um",
    "umm",
    "uh",
    "er",
    "erm",
    "hmm",
    "hm",
    "wow",
    "so",
    "well",
    "quick",
    "quickly",
    "question",
    "q",
    "query",
    "wondering",
    "wonder",
    "wondered",
    "curious",
    "asking",
    "ask",
    "asked",
    "bother",
    "bothering",
    "mate",
    "pal",
    "buddy",
    "friend",
    "folks",
    "guys",
    "all",
    "team",
    "again",
    "also",
    "btw",
    "way",
    "love",
    "lovely",
    "great",
    "awesome",
    "cool",
    "nice",
    "brilliant",
    "perfect",
    "grand",
    "help",
    "bot",
    "assistant",
    "there",
    "please",
    "kindly",
    "possible",
    "possibly",
    "maybe",
    "perhaps",
    "happen",
    "happens",
    "chance",
    "know",
    "remember",
    "forgot",
    "forget",
    "heard",
    "hear",
    "read",
    "saw",
    "seen",
    "news",
    "told",
    "trying",
    "try",
    "work",
    "figure",
    "sort",
];

/// Words that open a question; a chatty opening ends where one of them
/// starts the question proper.
const QUESTION_WORDS: &[&str] = &[
    "who", "whom", "whose", "what", "which", "when", "where", "why", "how",
];

/// Verbs that open a yes/no question or a request.
const OPENERS: &[&str] = &[
    "is", "are", "was", "were", "has", "have", "had", "did", "does", "do", "can", "could", "will",
    "would", "should", "tell", "give", "show", "list", "any", "let",
];

/// Expands contractions and chat short forms, in place of the word.
pub fn expand(tokens: &[&str]) -> Vec<String> {
    let mut out = Vec::with_capacity(tokens.len() + 2);
    for t in tokens {
        let table = CONTRACTIONS.iter().chain(SHORT_FORMS).find(|(w, _)| w == t);
        match table {
            Some((_, words)) => out.extend(words.iter().map(|w| w.to_string())),
            None => out.push(t.to_string()),
        }
    }
    out
}

/// Everyday English words (SCOWL's small British list, see
/// `english-words.COPYING`), one per line after `#` comment lines.
static DICTIONARY: std::sync::LazyLock<std::collections::HashSet<&'static str>> =
    std::sync::LazyLock::new(|| {
        include_str!("english-words.txt")
            .lines()
            .filter(|l| !l.starts_with('#') && !l.is_empty())
            .collect()
    });

/// Whether a word is an everyday English word. A reader's ordinary word on
/// its own ("world", "mate") is not a misspelt name, however close it looks
/// to one; names made of such words are still found exactly, and misheard
/// names spread over several words ("key rocket") are looked up as a whole.
pub fn is_dictionary_word(word: &str) -> bool {
    DICTIONARY.contains(word)
}

/// Single words English uses mostly as adverbs (WordNet 3.0, see
/// `english-adverbs.COPYING` and tools/english-adverbs.py).
static ADVERBS: std::sync::LazyLock<std::collections::HashSet<&'static str>> =
    std::sync::LazyLock::new(|| {
        include_str!("english-adverbs.txt")
            .lines()
            .filter(|l| !l.starts_with('#') && !l.is_empty())
            .collect()
    });

/// Adverbs that narrow what is asked ("only the wards counted at the
/// leisure centre"): answering without them answers a wider question.
const NARROWING_ADVERBS: &[&str] = &["only", "solely", "exclusively", "except", "excluding"];

/// Whether a word is an adverb that does not change what is asked
/// ("altogether", "roughly", "anyway"): left unexplained, it lowers the
/// confidence of an answer but does not make the question another one.
pub fn is_softening_adverb(word: &str) -> bool {
    ADVERBS.contains(word) && !NARROWING_ADVERBS.contains(&word)
}

/// Whether a word carries no content of its own (a function word or a word
/// of chat).
pub fn is_filler(word: &str) -> bool {
    FUNCTION_WORDS.contains(&word) || CHAT_WORDS.contains(&word)
}

/// Whether a word is a function word (not chat).
pub fn is_function_word(word: &str) -> bool {
    FUNCTION_WORDS.contains(&word)
}

/// Where the question proper starts: the first question word ("who",
/// "how"...), else the first verb that opens a yes/no question or a request
/// after nothing but chat words, else the start. Words before it are a
/// chatty opening ("my son was asking who won …", "hi quick one is …").
pub fn onset(tokens: &[&str]) -> usize {
    if let Some(i) = tokens.iter().position(|t| QUESTION_WORDS.contains(t)) {
        return i;
    }
    for (i, t) in tokens.iter().enumerate() {
        if OPENERS.contains(t) {
            return i;
        }
        if !CHAT_WORDS.contains(t) && !FUNCTION_WORDS.contains(t) {
            return 0;
        }
    }
    0
}

/// Replaces runs of number words by their value in figures ("two hundred
/// fly" → "200 fly", "a hundred" → "100"). A lone "one" stays: it is a
/// pronoun as often as a number ("the second one", "which one").
pub fn numbers(tokens: Vec<String>) -> Vec<String> {
    let mut out: Vec<String> = Vec::with_capacity(tokens.len());
    let mut i = 0;
    while i < tokens.len() {
        // "a hundred", "hundred" alone: one hundred.
        if tokens[i] == "hundred"
            || (tokens[i] == "a" && tokens.get(i + 1).map(String::as_str) == Some("hundred"))
        {
            let skip = if tokens[i] == "a" { 2 } else { 1 };
            // "a hundred and fifty": the rest of the number follows.
            let mut run: Vec<&str> = vec!["one", "hundred"];
            let mut j = i + skip;
            while j < tokens.len() && is_number_word(&tokens[j]) && tokens[j] != "hundred" {
                run.push(&tokens[j]);
                j += 1;
            }
            while run.len() > 2 && parse_number_words(&run).is_none() {
                run.pop();
                j -= 1;
            }
            // A trailing "and" is the sentence's, not the number's.
            if run.last() == Some(&"and") {
                run.pop();
                j -= 1;
            }
            if let Some(v) = parse_number_words(&run) {
                out.push(v.to_string());
                i = j;
                continue;
            }
        }
        if is_number_word(&tokens[i]) && tokens[i] != "and" {
            // The longest well-formed run starting here.
            let mut end = i;
            while end < tokens.len() && is_number_word(&tokens[end]) {
                end += 1;
            }
            let mut found = None;
            for e in (i + 1..=end).rev() {
                let run: Vec<&str> = tokens[i..e].iter().map(String::as_str).collect();
                if run.last() == Some(&"and") {
                    continue;
                }
                if let Some(v) = parse_number_words(&run) {
                    found = Some((e, v));
                    break;
                }
            }
            if let Some((e, v)) = found {
                if !(e == i + 1 && tokens[i] == "one") {
                    out.push(v.to_string());
                    i = e;
                    continue;
                }
            }
        }
        out.push(tokens[i].clone());
        i += 1;
    }
    out
}

/// Ordinal words below twenty, and the tens.
const ORDINAL_UNITS: [&str; 20] = [
    "zeroth",
    "first",
    "second",
    "third",
    "fourth",
    "fifth",
    "sixth",
    "seventh",
    "eighth",
    "ninth",
    "tenth",
    "eleventh",
    "twelfth",
    "thirteenth",
    "fourteenth",
    "fifteenth",
    "sixteenth",
    "seventeenth",
    "eighteenth",
    "nineteenth",
];
const ORDINAL_TENS: [&str; 8] = [
    "twentieth",
    "thirtieth",
    "fortieth",
    "fiftieth",
    "sixtieth",
    "seventieth",
    "eightieth",
    "ninetieth",
];
const TENS: [&str; 8] = [
    "twenty", "thirty", "forty", "fifty", "sixty", "seventy", "eighty", "ninety",
];

/// An ordinal at `tokens[i]`: "fifth", "5th", "twenty first" (two words,
/// as a hyphen leaves it), with how many tokens it spans. Below 100.
pub fn ordinal_at(tokens: &[&str], i: usize) -> Option<(u32, usize)> {
    let t = *tokens.get(i)?;
    if let Some(n) = ORDINAL_UNITS.iter().position(|w| *w == t) {
        return (n > 0).then_some((n as u32, 1));
    }
    if let Some(n) = ORDINAL_TENS.iter().position(|w| *w == t) {
        return Some((n as u32 * 10 + 20, 1));
    }
    if let Some(tens) = TENS.iter().position(|w| *w == t) {
        let next = *tokens.get(i + 1)?;
        let unit = ORDINAL_UNITS.iter().position(|w| *w == next)?;
        return (1..=9)
            .contains(&unit)
            .then_some((tens as u32 * 10 + 20 + unit as u32, 2));
    }
    // "5th", "21st", "2nd", "3rd": the suffix must be the right one.
    let digits = t.trim_end_matches(|c: char| c.is_ascii_alphabetic());
    let suffix = &t[digits.len()..];
    let n: u32 = digits.parse().ok()?;
    (n > 0 && !suffix.is_empty() && suffix == ordinal_suffix(n)).then_some((n, 1))
}

/// The English ordinal suffix of a number: "st", "nd", "rd" or "th".
pub fn ordinal_suffix(n: u32) -> &'static str {
    match (n % 100, n % 10) {
        (11..=13, _) => "th",
        (_, 1) => "st",
        (_, 2) => "nd",
        (_, 3) => "rd",
        _ => "th",
    }
}

#[cfg(test)]
mod tests {
    #[test]
    fn everyday_words_come_from_the_word_list() {
        // Entries of SCOWL's small British list (Debian wbritish-small).
        for w in ["world", "mate", "record", "colour", "sliver"] {
            assert!(is_dictionary_word(w), "{w}");
        }
        // Not entries: invented names, misspellings, capitalised entries.
        for w in ["worel", "kalvenmark", "recrod", "london"] {
            assert!(!is_dictionary_word(w), "{w}");
        }
    }

    use super::*;
    use crate::understand::normalize::normalize;

    fn read(s: &str) -> String {
        let n = normalize(s);
        let t: Vec<&str> = n.split(' ').collect();
        numbers(expand(&t)).join(" ")
    }

    #[test]
    fn contractions_and_their_misspellings_are_expanded() {
        assert_eq!(read("who's leading?"), "who is leading");
        assert_eq!(read("whos leading"), "who is leading");
        assert_eq!(read("Where’s the final?"), "where is the final");
        assert_eq!(read("how'd she do"), "how did she do");
        assert_eq!(read("she hasn't won"), "she has not won");
        assert_eq!(
            read("pls tell me who won tmrw"),
            "please tell me who won tomorrow"
        );
        // Words of their own stay.
        assert_eq!(read("its time were ill"), "its time were ill");
    }

    #[test]
    fn number_words_become_figures_but_one_stays_a_pronoun() {
        assert_eq!(read("the two hundred fly"), "the 200 fly");
        assert_eq!(read("hundred free"), "100 free");
        assert_eq!(read("a hundred and fifty"), "150");
        assert_eq!(read("the four hundred"), "the 400");
        assert_eq!(read("top three"), "top 3");
        assert_eq!(read("the second one"), "the second one");
        assert_eq!(read("which one won"), "which one won");
        assert_eq!(read("one hundred"), "100");
        assert_eq!(read("three and four"), "3 and 4");
        assert_eq!(read("fifteen hundred"), "1500");
    }

    #[test]
    fn a_question_starts_after_a_chatty_opening() {
        let on = |s: &str| {
            let t: Vec<&str> = s.split(' ').collect();
            onset(&t)
        };
        assert_eq!(on("my son was asking who won the 100 m"), 4);
        assert_eq!(on("hi quick one is it over"), 3);
        assert_eq!(on("who won"), 0);
        assert_eq!(on("galkace results"), 0);
    }

    /// The English ordinal categories of the CLDR plural rules (from
    /// memory): "one" → st when n % 10 = 1 and n % 100 ≠ 11; "two" → nd
    /// when n % 10 = 2 and n % 100 ≠ 12; "few" → rd when n % 10 = 3 and
    /// n % 100 ≠ 13; "other" → th.
    #[test]
    fn ordinal_suffixes_follow_the_cldr_english_ordinal_rules() {
        for n in 1..=2100u32 {
            let cldr = if n % 10 == 1 && n % 100 != 11 {
                "st"
            } else if n % 10 == 2 && n % 100 != 12 {
                "nd"
            } else if n % 10 == 3 && n % 100 != 13 {
                "rd"
            } else {
                "th"
            };
            assert_eq!(ordinal_suffix(n), cldr, "{n}");
            let figure = format!("{n}{cldr}");
            assert_eq!(ordinal_at(&[&figure], 0), Some((n, 1)));
        }
        assert_eq!(ordinal_at(&["11st"], 0), None);
        assert_eq!(ordinal_at(&["3th"], 0), None);
    }

    /// Cardinal and ordinal words from num2words 0.5.14 (PyPI), the fixture
    /// `tests/fixtures/num2words_en.tsv`: every cardinal 1–2100 reads back
    /// as its value, every ordinal 1–99 as its place.
    #[test]
    fn number_and_ordinal_words_read_as_num2words_writes_them() {
        let text = include_str!("../../tests/fixtures/num2words_en.tsv");
        let mut checked = 0;
        for line in text.lines().filter(|l| !l.starts_with('#')) {
            let cols: Vec<&str> = line.split('\t').collect();
            let n: u64 = cols[0].parse().unwrap();
            if n == 0 || n > 2100 {
                continue;
            }
            let words = normalize(cols[1]);
            let toks: Vec<String> = words.split(' ').map(String::from).collect();
            let got = numbers(toks);
            if n == 1 {
                assert_eq!(got, ["one"]);
            } else {
                assert_eq!(got, [n.to_string()], "{}", cols[1]);
            }
            if n < 100 {
                let ord = normalize(cols[2]);
                let t: Vec<&str> = ord.split(' ').collect();
                assert_eq!(ordinal_at(&t, 0), Some((n as u32, t.len())), "{}", cols[2]);
            }
            checked += 1;
        }
        assert_eq!(checked, 2100);
    }

    /// WordNet 3.0 (Debian package wordnet-base): "altogether" and
    /// "roughly" are tagged as adverbs more often than anything else;
    /// "still" more often as an adjective, "night" is a noun and "finish"
    /// a verb. "only" is an adverb that narrows what is asked.
    #[test]
    fn adverbs_that_do_not_change_the_question_follow_wordnet() {
        for w in ["altogether", "roughly", "anyway", "actually", "currently"] {
            assert!(is_softening_adverb(w), "{w}");
        }
        for w in ["still", "night", "finish", "height", "population", "only"] {
            assert!(!is_softening_adverb(w), "{w}");
        }
    }

    /// The committed list is what tools/english-adverbs.py derives from
    /// the WordNet 3.0 index files Debian's wordnet-base ships.
    #[test]
    fn the_adverb_list_is_derived_from_wordnet() {
        let dir = "/usr/share/wordnet";
        assert!(
            std::path::Path::new(dir).join("index.adv").exists(),
            "{dir}/index.adv not found: install Debian's wordnet-base package \
             (apt-get install -y wordnet-base)"
        );
        let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR"));
        let out = std::process::Command::new("python3")
            .arg(root.join("tools/english-adverbs.py"))
            .arg(dir)
            .output()
            .expect("running python3 tools/english-adverbs.py");
        assert!(
            out.status.success(),
            "{}",
            String::from_utf8_lossy(&out.stderr)
        );
        let derived = String::from_utf8(out.stdout).unwrap();
        assert_eq!(
            derived.trim_end(),
            include_str!("english-adverbs.txt").trim_end(),
            "regenerate with: python3 tools/english-adverbs.py > src/understand/english-adverbs.txt"
        );
    }
}
