//! English wording helpers for replies: numbers in words and figures,
//! ordinals, plurals, counted nouns, lists and sentence tidying.
//!
//! Replies go out on chat, SMS and voice, so the same fact has to read well
//! as text and sound right when a speech engine reads it aloud. The style is
//! British newsroom English: "one hundred and five", "A, B and C" without a
//! serial comma, words for small counts and figures for larger ones.

/// Names of the numbers below twenty, indexed by value.
pub const UNITS: [&str; 20] = [
    "zero",
    "one",
    "two",
    "three",
    "four",
    "five",
    "six",
    "seven",
    "eight",
    "nine",
    "ten",
    "eleven",
    "twelve",
    "thirteen",
    "fourteen",
    "fifteen",
    "sixteen",
    "seventeen",
    "eighteen",
    "nineteen",
];

/// Names of the tens, indexed by the tens digit (0 and 1 unused).
const TENS: [&str; 10] = [
    "", "", "twenty", "thirty", "forty", "fifty", "sixty", "seventy", "eighty", "ninety",
];

/// Short-scale names of successive powers of a thousand; seven groups cover
/// every `u64` (its maximum is about 18 quintillion).
const SCALES: [&str; 7] = [
    "",
    "thousand",
    "million",
    "billion",
    "trillion",
    "quadrillion",
    "quintillion",
];

/// Words for 1..=999, "hundred and" style ("one hundred and five").
fn group_words(n: u64, out: &mut String) {
    debug_assert!(n > 0 && n < 1000);
    let hundreds = n / 100;
    let rest = n % 100;
    if hundreds > 0 {
        out.push_str(UNITS[hundreds as usize]);
        out.push_str(" hundred");
        if rest > 0 {
            out.push_str(" and ");
        }
    }
    if rest == 0 {
        return;
    }
    if rest < 20 {
        out.push_str(UNITS[rest as usize]);
    } else {
        out.push_str(TENS[(rest / 10) as usize]);
        if !rest.is_multiple_of(10) {
            out.push('-');
            out.push_str(UNITS[(rest % 10) as usize]);
        }
    }
}

/// A whole number in words, British style: 21 → "twenty-one",
/// 105 → "one hundred and five", 1234 → "one thousand, two hundred and
/// thirty-four", 2027 → "two thousand and twenty-seven",
/// 1_000_000 → "one million".
///
/// Groups of thousands are separated by a comma, except that a final group
/// below one hundred is joined with "and" ("one million and ten"); within a
/// group, "and" follows the hundreds. This matches the reference wording of
/// the num2words library for English, which the tests check against.
pub fn cardinal(n: u64) -> String {
    if n == 0 {
        return UNITS[0].to_string();
    }
    // Split into groups of three digits, most significant first, keeping
    // only the non-zero ones: zero groups are not said ("one million and ten").
    let mut groups: Vec<(u64, usize)> = Vec::new();
    let mut rest = n;
    let mut scale = 0;
    while rest > 0 {
        let g = rest % 1000;
        if g > 0 {
            groups.push((g, scale));
        }
        rest /= 1000;
        scale += 1;
    }
    groups.reverse();
    let mut out = String::new();
    let last = groups.len() - 1;
    for (i, &(g, scale)) in groups.iter().enumerate() {
        if i > 0 {
            // A trailing small group reads as "... thousand and five"; any
            // other group boundary is a comma.
            if i == last && scale == 0 && g < 100 {
                out.push_str(" and ");
            } else {
                out.push_str(", ");
            }
        }
        group_words(g, &mut out);
        if scale > 0 {
            out.push(' ');
            out.push_str(SCALES[scale]);
        }
    }
    out
}

/// A whole number as an ordinal in words: "first", "second",
/// "twenty-second", "one hundred and first", "one thousand, two hundred and
/// thirty-fourth"; 0 → "zeroth". Same grouping as [`cardinal`].
pub fn ordinal(n: u64) -> String {
    let words = cardinal(n);
    // Only the last word changes, and in a hyphenated number only its last
    // part ("twenty-one" → "twenty-first").
    let split = words.rfind([' ', '-']).map_or(0, |i| i + 1);
    let (head, last) = words.split_at(split);
    let last = match last {
        "one" => "first".to_string(),
        "two" => "second".to_string(),
        "three" => "third".to_string(),
        "five" => "fifth".to_string(),
        "eight" => "eighth".to_string(),
        "nine" => "ninth".to_string(),
        "twelve" => "twelfth".to_string(),
        w if w.ends_with('y') => format!("{}ieth", &w[..w.len() - 1]),
        w => format!("{w}th"),
    };
    format!("{head}{last}")
}

/// A whole number as a figure with an ordinal suffix: "1st", "2nd", "3rd",
/// "4th", "11th", "12th", "13th", "21st", "102nd", "111th".
///
/// No thousands separator is added, because ordinals in replies are places
/// and rounds, which are small.
pub fn ordinal_figure(n: u64) -> String {
    // 11, 12 and 13 (and 111, 212, ...) take "th" despite their last digit.
    let suffix = match (n % 100, n % 10) {
        (11..=13, _) => "th",
        (_, 1) => "st",
        (_, 2) => "nd",
        (_, 3) => "rd",
        _ => "th",
    };
    format!("{n}{suffix}")
}

/// A whole number in figures with comma thousands separators: 12 → "12",
/// 1234 → "1,234", 1_000_000 → "1,000,000".
///
/// Separators start at four digits, the usual newsroom style for counts
/// such as vote totals.
pub fn figures(n: u64) -> String {
    let digits = n.to_string();
    let mut out = String::with_capacity(digits.len() + digits.len() / 3);
    for (i, c) in digits.chars().enumerate() {
        if i > 0 && (digits.len() - i).is_multiple_of(3) {
            out.push(',');
        }
        out.push(c);
    }
    out
}

/// A count as it is written in running text: words for zero to nine,
/// figures (with thousands separators) from 10: "three", "12", "1,234".
///
/// Zero is simply "zero": callers that prefer "no medals" can say so
/// themselves, since only they know whether the sentence allows it.
pub fn running_number(n: u64) -> String {
    if n < 10 {
        cardinal(n)
    } else {
        figures(n)
    }
}

/// How [`count_noun`] writes its number.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum NumberStyle {
    /// Words below ten, figures from ten ([`running_number`]); the default
    /// for chat and SMS.
    #[default]
    Running,
    /// Always figures, with thousands separators ([`figures`]).
    Figures,
    /// Always words ([`cardinal`]); for voice.
    Words,
}

/// Nouns whose plural does not follow the spelling rules, lower case.
const IRREGULAR: &[(&str, &str)] = &[
    ("person", "people"),
    ("man", "men"),
    ("woman", "women"),
    ("child", "children"),
    ("foot", "feet"),
    ("tooth", "teeth"),
    ("goose", "geese"),
    ("mouse", "mice"),
    ("half", "halves"),
    ("leaf", "leaves"),
    ("life", "lives"),
    ("wife", "wives"),
    ("knife", "knives"),
    ("shelf", "shelves"),
    ("wolf", "wolves"),
    ("quiz", "quizzes"),
    ("hero", "heroes"),
    ("potato", "potatoes"),
    ("tomato", "tomatoes"),
    ("sportsman", "sportsmen"),
    ("sportswoman", "sportswomen"),
    ("chairman", "chairmen"),
    ("chairwoman", "chairwomen"),
    ("spokesperson", "spokespeople"),
    ("horseman", "horsemen"),
    ("horsewoman", "horsewomen"),
];

/// Nouns that are the same in the plural, lower case.
const INVARIANT: &[&str] = &[
    "series", "species", "sheep", "deer", "fish", "aircraft", "news",
];

/// The English plural of a noun: medal → medals, match → matches,
/// box → boxes, country → countries, day → days, heat → heats,
/// person → people, man → men, woman → women.
///
/// Rules: a short list of irregular and unchanging nouns first; then
/// -s, -sh, -ch, -x and -z add "es"; a consonant before a final y becomes
/// "ies"; everything else adds "s". In a phrase only the last word changes
/// ("gold medal" → "gold medals"). A capitalised word stays capitalised and
/// an all-capitals word stays in capitals, so names of things read right.
pub fn plural(noun: &str) -> String {
    let split = noun.rfind(' ').map_or(0, |i| i + 1);
    let (head, word) = noun.split_at(split);
    if word.is_empty() {
        return noun.to_string();
    }
    let lower = word.to_lowercase();
    let plural_lower = if let Some(&(_, p)) = IRREGULAR.iter().find(|(s, _)| *s == lower) {
        p.to_string()
    } else if INVARIANT.contains(&lower.as_str()) {
        lower.clone()
    } else if ["s", "sh", "ch", "x", "z"]
        .iter()
        .any(|end| lower.ends_with(end))
    {
        format!("{lower}es")
    } else if lower.ends_with('y')
        && lower
            .chars()
            .rev()
            .nth(1)
            .is_some_and(|c| c.is_alphabetic() && !"aeiou".contains(c))
    {
        format!("{}ies", &lower[..lower.len() - 1])
    } else {
        format!("{lower}s")
    };
    let letters: Vec<char> = word.chars().filter(|c| c.is_alphabetic()).collect();
    let all_caps = letters.len() > 1 && letters.iter().all(|c| c.is_uppercase());
    let word_plural = if all_caps {
        plural_lower.to_uppercase()
    } else if word.chars().next().is_some_and(char::is_uppercase) {
        // Keep the writer's own spelling of the stem (e.g. "McLaren") and only
        // change the ending when the plural simply extends the word.
        if plural_lower.starts_with(&lower) {
            format!("{word}{}", &plural_lower[lower.len()..])
        } else {
            capitalize_first(&plural_lower)
        }
    } else if plural_lower.starts_with(&lower) {
        format!("{word}{}", &plural_lower[lower.len()..])
    } else {
        plural_lower
    };
    format!("{head}{word_plural}")
}

/// A counted noun: `count_noun(1, "medal", None, NumberStyle::Running)` →
/// "one medal"; 3 → "three medals"; 12 → "12 medals".
///
/// `plural` overrides the computed plural (see [`plural`]) for nouns the
/// rules get wrong. The singular is used for exactly one only: "zero medals".
pub fn count_noun(n: u64, singular: &str, plural: Option<&str>, style: NumberStyle) -> String {
    let number = match style {
        NumberStyle::Running => running_number(n),
        NumberStyle::Figures => figures(n),
        NumberStyle::Words => cardinal(n),
    };
    let noun = if n == 1 {
        singular.to_string()
    } else {
        plural.map_or_else(|| self::plural(singular), str::to_string)
    };
    format!("{number} {noun}")
}

/// Joins items as an English list: "" / "A" / "A and B" / "A, B and C".
///
/// `conj` is the joining word ("and", "or"). There is no comma before it,
/// as is usual in British newsrooms.
pub fn join_list(items: &[String], conj: &str) -> String {
    match items {
        [] => String::new(),
        [one] => one.clone(),
        [init @ .., last] => format!("{} {conj} {last}", init.join(", ")),
    }
}

/// The text with its first character in upper case ("gold" → "Gold").
/// Other characters are left alone, so names inside keep their spelling.
pub fn capitalize_first(s: &str) -> String {
    let mut chars = s.chars();
    match chars.next() {
        Some(first) => first.to_uppercase().chain(chars).collect(),
        None => String::new(),
    }
}

/// The text ending in a full stop: adds "." unless it already ends with
/// ".", "!", "?" or "…", or with a closing quote or bracket right after one
/// of those (`She said "yes."`). Trailing whitespace is dropped first, and
/// empty text stays empty, since a lone "." is no sentence.
pub fn ensure_period(s: &str) -> String {
    let text = s.trim_end();
    if text.is_empty() {
        return String::new();
    }
    let is_end = |c: char| matches!(c, '.' | '!' | '?' | '…');
    let is_closer = |c: char| matches!(c, '"' | '\'' | '”' | '’' | ')' | '»');
    // Skip closing quotes and brackets and look at what they close.
    let last_real = text.chars().rev().find(|&c| !is_closer(c));
    if last_real.is_some_and(is_end) {
        text.to_string()
    } else {
        format!("{text}.")
    }
}

/// A decimal written in digits, spoken: "10.12" → "ten point one two",
/// "8.21" → "eight point two one", "0.05" → "zero point zero five",
/// "14.533" → "fourteen point five three three", "87" → "eighty-seven".
///
/// The whole part is read as a number and the decimals digit by digit, as
/// announcers read results; trailing zeros are kept because they were
/// written on purpose ("9.80"). A leading "-" is read as "minus", and a
/// missing whole part ("0.5" written ".5") as "zero". Text that is not a
/// plain decimal is returned unchanged so that the caller's reply still
/// carries the fact rather than nothing.
pub fn decimal_words(s: &str) -> String {
    let (sign, body) = match s.strip_prefix('-') {
        Some(rest) => ("minus ", rest),
        None => ("", s),
    };
    let (whole, frac) = match body.split_once('.') {
        Some((w, f)) => (w, Some(f)),
        None => (body, None),
    };
    let all_digits = |t: &str| t.bytes().all(|b| b.is_ascii_digit());
    let valid = all_digits(whole)
        && frac.is_none_or(|f| all_digits(f) && !f.is_empty())
        && !(whole.is_empty() && frac.is_none());
    if !valid {
        return s.to_string();
    }
    let whole_words = if whole.is_empty() {
        cardinal(0)
    } else {
        match whole.parse::<u64>() {
            Ok(n) => cardinal(n),
            // Too long for a number: read it digit by digit rather than fail.
            Err(_) => digit_words(whole),
        }
    };
    match frac {
        Some(f) => format!("{sign}{whole_words} point {}", digit_words(f)),
        None => format!("{sign}{whole_words}"),
    }
}

/// Each ASCII digit as a word, space-separated ("05" → "zero five").
fn digit_words(digits: &str) -> String {
    digits
        .bytes()
        .map(|b| UNITS[usize::from(b - b'0')])
        .collect::<Vec<_>>()
        .join(" ")
}

#[cfg(test)]
mod tests {
    use super::*;

    // Reference: PyPI num2words 0.5.14, generated by (in bash, from the
    // crate root; the fixture's first line repeats it):
    //   python3 -m venv /tmp/n2w && /tmp/n2w/bin/pip install num2words==0.5.14 \
    //   && /tmp/n2w/bin/python -c $'from num2words import num2words as w\nfor n in
    //   [*range(2101), 10000, 21000, 100000, 123456, 1000000]: print(n,
    //   w(n, lang="en"), w(n, lang="en", to="ordinal"), sep="\\t")'
    //   >> tests/fixtures/num2words_en.tsv
    // Every whole number up to 2100 is covered: clock hours and minutes,
    // places, counts, marks' whole parts and distances such as 1500 are all
    // said by the voice channel.
    // The fixture is read at run time so a missing file fails this test only.
    const FIXTURE: &str = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/tests/fixtures/num2words_en.tsv"
    );

    #[test]
    fn cardinal_and_ordinal_match_num2words_fixture() {
        let text = std::fs::read_to_string(FIXTURE)
            .unwrap_or_else(|e| panic!("cannot read {FIXTURE}: {e}"));
        let mut checked = 0;
        for line in text.lines() {
            if line.starts_with('#') || line.trim().is_empty() {
                continue;
            }
            let cols: Vec<&str> = line.split('\t').collect();
            assert_eq!(cols.len(), 3, "bad fixture line {line:?}");
            let n: u64 = cols[0].parse().expect("fixture number");
            assert_eq!(cardinal(n), cols[1], "cardinal({n})");
            assert_eq!(ordinal(n), cols[2], "ordinal({n})");
            checked += 1;
        }
        // 0..=2100 and five larger values.
        assert_eq!(checked, 2106);
    }

    #[test]
    fn cardinal_examples() {
        assert_eq!(cardinal(0), "zero");
        assert_eq!(cardinal(21), "twenty-one");
        assert_eq!(cardinal(105), "one hundred and five");
        assert_eq!(cardinal(1234), "one thousand, two hundred and thirty-four");
        assert_eq!(cardinal(1_000_000), "one million");
        assert_eq!(cardinal(2027), "two thousand and twenty-seven");
    }

    #[test]
    fn cardinal_large_numbers_follow_reference_grouping() {
        // Values taken from num2words 0.5.14 as well, beyond the fixture's range.
        assert_eq!(cardinal(1_000_010), "one million and ten");
        assert_eq!(cardinal(1_001_000), "one million, one thousand");
        assert_eq!(cardinal(100_100), "one hundred thousand, one hundred");
        assert_eq!(cardinal(2_000_000_100), "two billion, one hundred");
        assert_eq!(cardinal(1_000_000_099), "one billion and ninety-nine");
        assert_eq!(
            cardinal(u64::MAX),
            "eighteen quintillion, four hundred and forty-six quadrillion, \
             seven hundred and forty-four trillion, seventy-three billion, \
             seven hundred and nine million, five hundred and fifty-one \
             thousand, six hundred and fifteen"
        );
        assert_eq!(ordinal(1_000_010), "one million and tenth");
        assert_eq!(ordinal(1_001_000), "one million, one thousandth");
    }

    #[test]
    fn ordinal_examples() {
        assert_eq!(ordinal(1), "first");
        assert_eq!(ordinal(2), "second");
        assert_eq!(ordinal(22), "twenty-second");
        assert_eq!(ordinal(101), "one hundred and first");
        assert_eq!(ordinal(0), "zeroth");
        assert_eq!(ordinal(40), "fortieth");
        assert_eq!(ordinal(12), "twelfth");
    }

    #[test]
    fn ordinal_figure_examples() {
        let cases = [
            (1, "1st"),
            (2, "2nd"),
            (3, "3rd"),
            (4, "4th"),
            (11, "11th"),
            (12, "12th"),
            (13, "13th"),
            (21, "21st"),
            (102, "102nd"),
            (111, "111th"),
            (0, "0th"),
            (112, "112th"),
            (1001, "1001st"),
        ];
        for (n, want) in cases {
            assert_eq!(ordinal_figure(n), want, "ordinal_figure({n})");
        }
    }

    #[test]
    fn figures_and_running_numbers() {
        assert_eq!(figures(0), "0");
        assert_eq!(figures(999), "999");
        assert_eq!(figures(1234), "1,234");
        assert_eq!(figures(1_000_000), "1,000,000");
        assert_eq!(running_number(0), "zero");
        assert_eq!(running_number(3), "three");
        assert_eq!(running_number(9), "nine");
        assert_eq!(running_number(10), "10");
        assert_eq!(running_number(12), "12");
        assert_eq!(running_number(1234), "1,234");
    }

    #[test]
    fn plural_examples() {
        let cases = [
            ("medal", "medals"),
            ("match", "matches"),
            ("box", "boxes"),
            ("country", "countries"),
            ("day", "days"),
            ("heat", "heats"),
            ("person", "people"),
            ("man", "men"),
            ("woman", "women"),
            ("bus", "buses"),
            ("dash", "dashes"),
            ("waltz", "waltzes"),
            ("party", "parties"),
            ("key", "keys"),
            ("series", "series"),
            ("gold medal", "gold medals"),
            ("Country", "Countries"),
            ("MATCH", "MATCHES"),
            ("Woman", "Women"),
        ];
        for (s, want) in cases {
            assert_eq!(plural(s), want, "plural({s:?})");
        }
    }

    #[test]
    fn count_noun_examples() {
        use NumberStyle::*;
        assert_eq!(count_noun(1, "medal", None, Running), "one medal");
        assert_eq!(count_noun(3, "medal", None, Running), "three medals");
        assert_eq!(count_noun(12, "medal", None, Running), "12 medals");
        assert_eq!(count_noun(0, "medal", None, Running), "zero medals");
        assert_eq!(count_noun(3, "medal", None, Figures), "3 medals");
        assert_eq!(count_noun(1, "medal", None, Figures), "1 medal");
        assert_eq!(count_noun(12, "medal", None, Words), "twelve medals");
        assert_eq!(count_noun(1234, "vote", None, Figures), "1,234 votes");
        assert_eq!(
            count_noun(2, "criterion", Some("criteria"), Running),
            "two criteria"
        );
        assert_eq!(count_noun(2, "person", None, Words), "two people");
    }

    #[test]
    fn join_list_examples() {
        let s = |v: &[&str]| v.iter().map(|x| x.to_string()).collect::<Vec<_>>();
        assert_eq!(join_list(&s(&[]), "and"), "");
        assert_eq!(join_list(&s(&["A"]), "and"), "A");
        assert_eq!(join_list(&s(&["A", "B"]), "and"), "A and B");
        assert_eq!(join_list(&s(&["A", "B", "C"]), "and"), "A, B and C");
        assert_eq!(join_list(&s(&["A", "B", "C", "D"]), "or"), "A, B, C or D");
    }

    #[test]
    fn capitalize_first_examples() {
        assert_eq!(capitalize_first(""), "");
        assert_eq!(capitalize_first("gold"), "Gold");
        assert_eq!(capitalize_first("éa"), "Éa");
        assert_eq!(capitalize_first("already Up"), "Already Up");
    }

    #[test]
    fn ensure_period_examples() {
        assert_eq!(ensure_period("Done"), "Done.");
        assert_eq!(ensure_period("Done."), "Done.");
        assert_eq!(ensure_period("Done!"), "Done!");
        assert_eq!(ensure_period("Done?"), "Done?");
        assert_eq!(ensure_period("Wait…"), "Wait…");
        assert_eq!(ensure_period("She said \"yes.\""), "She said \"yes.\"");
        assert_eq!(ensure_period("She said ‘yes!’"), "She said ‘yes!’");
        assert_eq!(ensure_period("She said \"yes\""), "She said \"yes\".");
        assert_eq!(ensure_period("Done  "), "Done.");
        assert_eq!(ensure_period(""), "");
    }

    #[test]
    fn decimal_words_examples() {
        assert_eq!(decimal_words("10.12"), "ten point one two");
        assert_eq!(decimal_words("8.21"), "eight point two one");
        assert_eq!(decimal_words("0.05"), "zero point zero five");
        assert_eq!(decimal_words("14.533"), "fourteen point five three three");
        assert_eq!(decimal_words("9.80"), "nine point eight zero");
        assert_eq!(decimal_words("87"), "eighty-seven");
        assert_eq!(decimal_words(".5"), "zero point five");
        assert_eq!(decimal_words("-1.5"), "minus one point five");
        assert_eq!(decimal_words("abc"), "abc");
        assert_eq!(decimal_words("1."), "1.");
        assert_eq!(decimal_words(""), "");
    }
}

/// "a" or "an" before a word, by its first sound as spelled: "an athlete",
/// "a swimmer", "a university", "an hour". Spelling rules with the common
/// exceptions (common practice); enough for nouns editors write.
pub fn indefinite_article(word: &str) -> &'static str {
    let w = word.trim_start().to_lowercase();
    // A "yoo" or "w" sound despite the vowel letter.
    const CONSONANT_SOUND: [&str; 6] = ["uni", "use", "usu", "eu", "one", "once"];
    // A silent h.
    const VOWEL_SOUND: [&str; 4] = ["hour", "honest", "honour", "heir"];
    if CONSONANT_SOUND.iter().any(|p| w.starts_with(p)) {
        return "a";
    }
    if VOWEL_SOUND.iter().any(|p| w.starts_with(p)) {
        return "an";
    }
    match w.chars().next() {
        Some('a' | 'e' | 'i' | 'o' | 'u') => "an",
        _ => "a",
    }
}

#[cfg(test)]
mod article_tests {
    use super::indefinite_article;

    #[test]
    fn article_follows_the_first_sound() {
        // Common practice of English usage, from memory.
        for (w, a) in [
            ("athlete", "an"),
            ("swimmer", "a"),
            ("oarsman", "an"),
            ("university", "a"),
            ("hour", "an"),
            ("European", "a"),
            ("umpire", "an"),
            ("gymnast", "a"),
        ] {
            assert_eq!(indefinite_article(w), a, "{w}");
        }
    }
}

/// Unit symbols that running text uses after a number, with their spoken
/// singular and plural (SI symbols; common practice for the rest).
const UNIT_WORDS: [(&str, &str, &str); 7] = [
    ("m", "metre", "metres"),
    ("km", "kilometre", "kilometres"),
    ("cm", "centimetre", "centimetres"),
    ("s", "second", "seconds"),
    ("kg", "kilogram", "kilograms"),
    ("pts", "point", "points"),
    ("%", "per cent", "per cent"),
];

/// Characters that may open a token around a number.
const OPENERS: &[char] = &['(', '[', '"', '\'', '\u{201C}', '\u{2018}'];
/// Characters that may close a token after a number or a unit.
const CLOSERS: &[char] = &[
    ',', '.', ';', ':', '!', '?', ')', ']', '"', '\'', '\u{201D}', '\u{2019}',
];

/// Running text with its numbers and unit symbols in words, for a speech
/// engine: "women's 100 m freestyle" → "women's one hundred metres
/// freestyle", "4.5 km" → "four point five kilometres". Words that are not
/// numbers are kept as written.
pub fn speak_numbers(text: &str) -> String {
    let tokens: Vec<&str> = text.split(' ').collect();
    let mut out: Vec<String> = Vec::with_capacity(tokens.len());
    let mut i = 0;
    while i < tokens.len() {
        let t = tokens[i];
        // Keep brackets and quotes that open the token and punctuation that
        // closes it ("(9.96 s)", "100 m,", "“who won the 100 m?”").
        let body = t.trim_start_matches(OPENERS);
        let lead = &t[..t.len() - body.len()];
        let core = body.trim_end_matches(CLOSERS);
        let tail = &body[core.len()..];
        let numeric = !core.is_empty()
            && core.bytes().any(|b| b.is_ascii_digit())
            && core
                .bytes()
                .all(|b| b.is_ascii_digit() || b == b'.' || b == b',');
        if numeric {
            let plain = core.replace(',', "");
            let next_is_unit = tokens
                .get(i + 1)
                .map(|n| n.trim_end_matches(CLOSERS))
                .is_some_and(|u| UNIT_WORDS.iter().any(|(sym, _, _)| *sym == u));
            let spoken = match plain.parse::<u64>() {
                // A four-digit number with no unit and no thousands comma in
                // a title is a year: "2027" is "twenty twenty-seven".
                Ok(y) if (1100..=2099).contains(&y) && !next_is_unit && !core.contains(',') => {
                    year_words(y)
                }
                // A distance in whole hundreds is said in hundreds, as
                // announcers do: "1500 m" is "fifteen hundred metres".
                Ok(d)
                    if next_is_unit
                        && (1100..=9900).contains(&d)
                        && d % 100 == 0
                        && d % 1000 != 0
                        && !core.contains(',') =>
                {
                    format!("{} hundred", cardinal(d / 100))
                }
                _ => decimal_words(&plain),
            };
            let next = tokens.get(i + 1).map(|n| {
                let c = n.trim_end_matches(CLOSERS);
                (c, &n[c.len()..])
            });
            if let Some((unit, unit_tail)) = next.filter(|(u, _)| !u.is_empty()) {
                if let Some((_, one, many)) = UNIT_WORDS.iter().find(|(sym, _, _)| *sym == unit) {
                    let word = if plain == "1" { one } else { many };
                    out.push(format!("{lead}{spoken} {word}{unit_tail}"));
                    i += 2;
                    continue;
                }
            }
            out.push(format!("{lead}{spoken}{tail}"));
        } else {
            out.push(t.to_string());
        }
        i += 1;
    }
    out.join(" ")
}

/// A year as it is said (common practice in British English): "nineteen
/// ninety", "two thousand and seven", "twenty twenty-seven", "nineteen oh
/// five".
pub fn year_words(y: u64) -> String {
    if (2000..=2009).contains(&y) {
        return cardinal(y).replace(", ", " ");
    }
    let (hi, lo) = (y / 100, y % 100);
    match lo {
        0 => format!("{} hundred", cardinal(hi)),
        1..=9 => format!("{} oh {}", cardinal(hi), cardinal(lo)),
        _ => format!("{} {}", cardinal(hi), cardinal(lo)),
    }
}

#[cfg(test)]
mod speak_tests {
    use super::speak_numbers;

    #[test]
    fn numbers_and_units_in_running_text_are_spoken() {
        assert_eq!(
            speak_numbers("the women's 100 m freestyle"),
            "the women's one hundred metres freestyle"
        );
        assert_eq!(
            speak_numbers("4.5 km, then 1 m."),
            "four point five kilometres, then one metre."
        );
        assert_eq!(speak_numbers("heat 2"), "heat two");
        assert_eq!(
            speak_numbers("the 1,500 m"),
            "the one thousand, five hundred metres"
        );
        assert_eq!(speak_numbers("no numbers here"), "no numbers here");
        assert_eq!(speak_numbers("the 1500 m"), "the fifteen hundred metres");
        assert_eq!(speak_numbers("the 3000 m"), "the three thousand metres");
        assert_eq!(
            speak_numbers("(9.96 s) or “the 100 m?”"),
            "(nine point nine six seconds) or “the one hundred metres?”"
        );
        assert_eq!(
            speak_numbers("The 2027 Games"),
            "The twenty twenty-seven Games"
        );
        assert_eq!(super::year_words(2007), "two thousand and seven");
        assert_eq!(super::year_words(1905), "nineteen oh five");
        assert_eq!(super::year_words(1900), "nineteen hundred");
    }
}
