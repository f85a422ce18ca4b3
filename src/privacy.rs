//! Personal data in readers' words: what is masked before a question is
//! kept on the unanswered list (or in a session's pending question).
//!
//! [`mask`] works on token classes, not on whole whitespace-separated
//! words, so punctuation next to a number (`…123?`, `"…"`, `tel:…`, `#…`)
//! does not hide it. The text is first put in NFKC and lowercased, so
//! full-width digits, other dashes and the like look like the plain ones.
//! Then, in this order:
//!
//! - links (`https://…`, `www.…`, `name.example`, "example dot com") become
//!   `link`;
//! - e-mail addresses, written (`jane.doe@example.test`, `jane @ example.test`,
//!   `jane(at)example(dot)test`) or spelled out ("jane dot doe at example
//!   dot test"), become `address`;
//! - IBANs that pass the ISO 13616 mod-97 check, grouped or not, become
//!   `account`;
//! - runs of digits (with spaces, dashes, dots, slashes, brackets or a
//!   leading `+` between them) of 12 to 19 digits that pass the Luhn check
//!   (ISO/IEC 7812) become `card`; other runs of more than five digits,
//!   and words mixing letters with more than five digits (national-id
//!   shapes such as `ab123456c`), become `number`; six or more spelled
//!   digits ("seven seven zero zero …") too.
//!
//! Short numbers ("100 m", "10,000 m", "the 18th", "21:10") and dates
//! (`14/08/2027`, `2027-08-14`) stay: they are part of questions.

use unicode_normalization::UnicodeNormalization;

/// More digits than this in one run is personal data.
const SHORT_NUMBER: usize = 5;

/// Top-level domains that mark a dotted word as a link. A short list on
/// purpose: "st.john" or "9.93" must not become links.
const TLDS: &[&str] = &[
    "com",
    "org",
    "net",
    "io",
    "co",
    "uk",
    "pt",
    "de",
    "fr",
    "es",
    "eu",
    "info",
    "biz",
    "me",
    "app",
    "dev",
    "gov",
    "edu",
    "test",
    "example",
    "invalid",
    "localhost",
    "ly",
    "tv",
    "news",
];

const DIGIT_WORDS: &[&str] = &[
    "zero", "oh", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine",
];

/// `text` with personal data replaced by the word for its class; see the
/// module documentation. The result is lowercase.
pub fn mask(text: &str) -> String {
    let folded: String = text
        .nfkc()
        .flat_map(char::to_lowercase)
        .map(|c| if is_dash(c) { '-' } else { c })
        .collect();
    let atoms = atoms(&folded);
    let mut labels: Vec<Option<&'static str>> = vec![None; atoms.len()];
    let mut masked = vec![false; atoms.len()];
    let passes: [Pass; 6] = [
        emails,
        spelled_emails,
        links,
        ibans,
        digit_runs,
        spelled_digits,
    ];
    for pass in passes {
        for span in pass(&atoms) {
            if masked[span.start..span.end].iter().any(|m| *m) {
                continue;
            }
            masked[span.start..span.end]
                .iter_mut()
                .for_each(|m| *m = true);
            labels[span.start] = Some(span.label);
        }
    }
    let mut out = String::with_capacity(folded.len());
    for (i, a) in atoms.iter().enumerate() {
        match (masked[i], labels[i]) {
            (true, Some(label)) => {
                if out.chars().last().is_some_and(char::is_alphanumeric) {
                    out.push(' ');
                }
                out.push_str(label);
                if atoms
                    .get(i + 1..)
                    .and_then(|rest| rest.iter().zip(&masked[i + 1..]).find(|(_, m)| !**m))
                    .is_some_and(|(next, _)| next.is_alnum())
                {
                    out.push(' ');
                }
            }
            (true, None) => {}
            (false, _) => out.push_str(a.text),
        }
    }
    out
}

/// Whether an IBAN passes its ISO 13616 check: letters moved from the front
/// to the back, letters as numbers (A = 10 … Z = 35), the whole mod 97 is 1.
/// `iban` is its letters and digits only, in any case.
pub fn iban_checks(iban: &str) -> bool {
    let b = iban.as_bytes();
    if !(15..=34).contains(&b.len())
        || !b[..2].iter().all(u8::is_ascii_alphabetic)
        || !b[2..4].iter().all(u8::is_ascii_digit)
        || !b.iter().all(u8::is_ascii_alphanumeric)
    {
        return false;
    }
    let mut rem: u32 = 0;
    for c in b[4..].iter().chain(&b[..4]) {
        let v = match c {
            b'0'..=b'9' => u32::from(c - b'0'),
            _ => u32::from(c.to_ascii_uppercase() - b'A') + 10,
        };
        rem = if v >= 10 {
            (rem * 100 + v) % 97
        } else {
            (rem * 10 + v) % 97
        };
    }
    rem == 1
}

/// Whether a string of digits passes the Luhn check (ISO/IEC 7812-1).
pub fn luhn_checks(digits: &str) -> bool {
    if digits.is_empty() || !digits.bytes().all(|b| b.is_ascii_digit()) {
        return false;
    }
    let sum: u32 = digits
        .bytes()
        .rev()
        .enumerate()
        .map(|(i, b)| {
            let d = u32::from(b - b'0');
            if i % 2 == 1 {
                let d2 = d * 2;
                if d2 > 9 {
                    d2 - 9
                } else {
                    d2
                }
            } else {
                d
            }
        })
        .sum();
    sum.is_multiple_of(10)
}

fn is_dash(c: char) -> bool {
    matches!(
        c,
        '\u{2010}'..='\u{2015}' | '\u{2212}' | '\u{fe58}' | '\u{fe63}' | '\u{ff0d}'
    )
}

/// A piece of the text: a run of letters and digits, a run of whitespace,
/// or one other character.
#[derive(Debug)]
struct Atom<'a> {
    text: &'a str,
    kind: AtomKind,
}

#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum AtomKind {
    Alnum,
    Space,
    Punct,
}

impl Atom<'_> {
    fn is_alnum(&self) -> bool {
        self.kind == AtomKind::Alnum
    }
    fn is(&self, s: &str) -> bool {
        self.text == s
    }
    fn digits(&self) -> usize {
        self.text.chars().filter(char::is_ascii_digit).count()
    }
    fn all_digits(&self) -> bool {
        self.is_alnum() && self.text.chars().all(|c| c.is_ascii_digit())
    }
}

fn atoms(s: &str) -> Vec<Atom<'_>> {
    let mut out = Vec::new();
    let mut start = 0;
    let mut kind: Option<AtomKind> = None;
    for (i, c) in s.char_indices() {
        let k = if c.is_alphanumeric() {
            AtomKind::Alnum
        } else if c.is_whitespace() {
            AtomKind::Space
        } else {
            AtomKind::Punct
        };
        // Punctuation is one atom per character; the others run on.
        if kind != Some(k) || k == AtomKind::Punct {
            if let Some(prev) = kind {
                out.push(Atom {
                    text: &s[start..i],
                    kind: prev,
                });
            }
            start = i;
            kind = Some(k);
        }
    }
    if let Some(k) = kind {
        out.push(Atom {
            text: &s[start..],
            kind: k,
        });
    }
    out
}

/// One class of personal data: the spans of it found in the atoms.
type Pass = fn(&[Atom]) -> Vec<Span>;

/// Atoms `start..end` to replace by `label`.
#[derive(Debug)]
struct Span {
    start: usize,
    end: usize,
    label: &'static str,
}

/// The end of the run of non-space atoms from `i`, less trailing
/// punctuation that ends a sentence or closes a quote.
fn word_end(a: &[Atom], i: usize) -> usize {
    let mut j = i;
    while j < a.len() && a[j].kind != AtomKind::Space {
        j += 1;
    }
    while j > i + 1 && a[j - 1].kind == AtomKind::Punct && !a[j - 1].is("/") {
        j -= 1;
    }
    j
}

fn links(a: &[Atom]) -> Vec<Span> {
    let mut out = Vec::new();
    let mut i = 0;
    while i < a.len() {
        let scheme = a[i].is_alnum()
            && matches!(a[i].text, "http" | "https" | "ftp")
            && a.get(i + 1).is_some_and(|x| x.is(":"))
            && a.get(i + 2).is_some_and(|x| x.is("/"));
        let www = a[i].is("www") && a.get(i + 1).is_some_and(|x| x.is("."));
        if starts_word(a, i) && (scheme || www || dotted_domain(a, i)) && !has_at_in_word(a, i) {
            let end = word_end(a, i);
            out.push(Span {
                start: i,
                end,
                label: "link",
            });
            i = end;
            continue;
        }
        // Spelled: "example dot com".
        if let Some(end) = spelled_domain(a, i) {
            out.push(Span {
                start: i,
                end,
                label: "link",
            });
            i = end;
            continue;
        }
        i += 1;
    }
    out
}

/// `name.tld` (and `name.name.tld/…`) starting at `i`, with no spaces.
fn dotted_domain(a: &[Atom], i: usize) -> bool {
    if !a[i].is_alnum() || a[i].all_digits() {
        return false;
    }
    let mut j = i;
    let mut dots = 0;
    while a.get(j + 1).is_some_and(|x| x.is(".")) && a.get(j + 2).is_some_and(Atom::is_alnum) {
        j += 2;
        dots += 1;
    }
    dots > 0 && TLDS.contains(&a[j].text) && !a.get(j + 1).is_some_and(Atom::is_alnum)
}

fn has_at_in_word(a: &[Atom], i: usize) -> bool {
    a[i..word_end(a, i)].iter().any(|x| x.is("@"))
}

/// The words from atom `i` on, as (atom index, word), as long as only
/// spaces and brackets lie between them: a spelled address is words. A
/// written `.` counts as the word "dot".
fn words_from<'a>(a: &[Atom<'a>], i: usize) -> Vec<(usize, &'a str)> {
    let mut out = Vec::new();
    for (j, x) in a.iter().enumerate().skip(i) {
        match x.kind {
            AtomKind::Alnum => out.push((j, x.text)),
            AtomKind::Space => {}
            // Only a dot inside a word: one that ends a sentence is none.
            AtomKind::Punct
                if x.text == "."
                    && j > 0
                    && a[j - 1].is_alnum()
                    && a.get(j + 1).is_some_and(Atom::is_alnum) =>
            {
                out.push((j, "dot"))
            }
            AtomKind::Punct if "()[]{}<>".contains(x.text) => {}
            AtomKind::Punct => break,
        }
    }
    out
}

/// A word that can be part of an address: it has a letter ("9.93" is no
/// domain).
fn namelike(w: &str) -> bool {
    w != "dot" && w != "at" && w.chars().any(char::is_alphabetic)
}

/// From `w[first]`, the index in `w` of the last word of `name (dot
/// name)*`.
fn dotted_run(w: &[(usize, &str)], first: usize) -> usize {
    let mut k = first;
    while k + 2 < w.len() && w[k + 1].1 == "dot" && namelike(w[k + 2].1) {
        k += 2;
    }
    k
}

fn starts_word(a: &[Atom], i: usize) -> bool {
    a[i].is_alnum() && (i == 0 || !a[i - 1].is_alnum())
}

/// "example dot com": names joined by "dot", the last a known domain.
fn spelled_domain(a: &[Atom], i: usize) -> Option<usize> {
    if !starts_word(a, i) || !namelike(a[i].text) {
        return None;
    }
    let w = words_from(a, i);
    let k = dotted_run(&w, 0);
    (k > 0 && TLDS.contains(&w[k].1)).then(|| w[k].0 + 1)
}

fn emails(a: &[Atom]) -> Vec<Span> {
    let mut out = Vec::new();
    for (i, at) in a.iter().enumerate() {
        if !at.is("@") {
            continue;
        }
        // The local part: the non-space atoms before, allowing one space
        // between it and the sign.
        let mut s = i;
        if s > 1 && a[s - 1].kind == AtomKind::Space && a[s - 2].is_alnum() {
            s -= 1;
        }
        while s > 0 && a[s - 1].kind != AtomKind::Space && !"\"'(<[:".contains(a[s - 1].text) {
            s -= 1;
        }
        let mut e = i + 1;
        if a.get(e).is_some_and(|x| x.kind == AtomKind::Space)
            && a.get(e + 1).is_some_and(Atom::is_alnum)
        {
            e += 1;
        }
        let end = if e < a.len() { word_end(a, e) } else { e };
        out.push(Span {
            start: s,
            end: end.max(i + 1),
            label: "address",
        });
    }
    out
}

/// "jane dot doe at example dot test", "jane(at)example(dot)test". Each
/// "at" is tried from the last one back, so in "write me at jane dot doe at
/// example dot test" the address is the part around the last "at".
fn spelled_emails(a: &[Atom]) -> Vec<Span> {
    let mut out = Vec::new();
    let mut i = 0;
    while i < a.len() {
        let w = words_from(a, i);
        let next = w.last().map_or(i + 1, |l| l.0 + 1);
        let mut taken = usize::MAX;
        for k in (1..w.len()).rev() {
            if w[k].1 != "at" || w[k].0 >= taken || !namelike(w[k - 1].1) {
                continue;
            }
            let mut s = k - 1;
            while s >= 2 && w[s - 1].1 == "dot" && namelike(w[s - 2].1) {
                s -= 2;
            }
            if k + 1 >= w.len() || !namelike(w[k + 1].1) {
                continue;
            }
            let last = dotted_run(&w, k + 1);
            if last > k + 1 && w[last].0 < taken {
                out.push(Span {
                    start: w[s].0,
                    end: w[last].0 + 1,
                    label: "address",
                });
                taken = w[s].0;
            }
        }
        i = next.max(i + 1);
    }
    out
}

fn ibans(a: &[Atom]) -> Vec<Span> {
    let mut out = Vec::new();
    let mut i = 0;
    while i < a.len() {
        let t = a[i].text.as_bytes();
        let starts = a[i].is_alnum()
            && (i == 0 || !a[i - 1].is_alnum())
            && t.len() >= 2
            && t[..2].iter().all(u8::is_ascii_alphabetic)
            && (t.len() == 2 || t[2].is_ascii_digit());
        if !starts {
            i += 1;
            continue;
        }
        // Gather groups separated by one space or dash, up to 34 characters.
        let mut chars = String::new();
        let mut ends: Vec<(usize, usize)> = Vec::new(); // (chars so far, atom end)
        let mut j = i;
        while j < a.len() && a[j].is_alnum() && chars.len() + a[j].text.len() <= 34 {
            chars.push_str(a[j].text);
            ends.push((chars.len(), j + 1));
            let sep = a
                .get(j + 1)
                .is_some_and(|x| x.kind == AtomKind::Space || x.is("-"));
            if sep && a.get(j + 2).is_some_and(Atom::is_alnum) {
                j += 2;
            } else {
                break;
            }
        }
        match ends.iter().rev().find(|(n, _)| iban_checks(&chars[..*n])) {
            Some(&(_, end)) => {
                out.push(Span {
                    start: i,
                    end,
                    label: "account",
                });
                i = end;
            }
            None => i += 1,
        }
    }
    out
}

/// Separators that may sit between the digit groups of one number.
fn joins_digits(x: &Atom) -> bool {
    x.kind == AtomKind::Space || (x.kind == AtomKind::Punct && "-./()+".contains(x.text))
}

fn digit_runs(a: &[Atom]) -> Vec<Span> {
    let mut out = Vec::new();
    let mut i = 0;
    while i < a.len() {
        if !a[i].is_alnum() || a[i].digits() == 0 {
            i += 1;
            continue;
        }
        // A word mixing letters and many digits: an id, masked whole.
        if !a[i].all_digits() {
            if a[i].digits() > SHORT_NUMBER {
                out.push(Span {
                    start: i,
                    end: i + 1,
                    label: "number",
                });
            }
            i += 1;
            continue;
        }
        let mut start = i;
        // A leading `+` or `(` belongs to the number.
        while start > 0 && a[start - 1].kind == AtomKind::Punct && "+(".contains(a[start - 1].text)
        {
            start -= 1;
        }
        let mut end = i + 1;
        let mut digits = a[i].text.to_string();
        let mut shape = a[i].text.len().to_string();
        loop {
            let mut j = end;
            let mut seps = String::new();
            while j < a.len() && joins_digits(&a[j]) && seps.chars().count() < 3 {
                seps.push_str(a[j].text);
                j += 1;
            }
            if j > end && j < a.len() && a[j].all_digits() && seps.chars().count() <= 3 {
                digits.push_str(a[j].text);
                shape.push_str(&seps);
                shape.push_str(&a[j].text.len().to_string());
                end = j + 1;
            } else {
                break;
            }
        }
        // A closing bracket right after belongs to it too.
        if a.get(end).is_some_and(|x| x.is(")")) && a[start..end].iter().any(|x| x.is("(")) {
            end += 1;
        }
        let label = if (12..=19).contains(&digits.len()) && luhn_checks(&digits) {
            Some("card")
        } else if digits.len() > SHORT_NUMBER && !is_date_shape(&shape) {
            Some("number")
        } else {
            None
        };
        if let Some(label) = label {
            out.push(Span { start, end, label });
        }
        i = end;
    }
    out
}

/// Group lengths and separators of a date: `2/2/4`, `2.2.2`, `4-2-2`.
fn is_date_shape(shape: &str) -> bool {
    for sep in ['/', '.', '-'] {
        let parts: Vec<&str> = shape.split(sep).collect();
        if parts.len() == 3 && parts.iter().all(|p| p.len() == 1) {
            let n: Vec<u8> = parts.iter().map(|p| p.as_bytes()[0] - b'0').collect();
            if matches!(n.as_slice(), [1 | 2, 1 | 2, 2 | 4] | [4, 1 | 2, 1 | 2]) {
                return true;
            }
        }
    }
    false
}

fn spelled_digits(a: &[Atom]) -> Vec<Span> {
    let mut out = Vec::new();
    let mut i = 0;
    while i < a.len() {
        if !DIGIT_WORDS.contains(&a[i].text) {
            i += 1;
            continue;
        }
        let mut end = i + 1;
        let mut count = 1;
        loop {
            let mut j = end;
            while j < a.len() && (a[j].kind == AtomKind::Space || a[j].is("-")) {
                j += 1;
            }
            if j > end && j < a.len() && DIGIT_WORDS.contains(&a[j].text) {
                count += 1;
                end = j + 1;
            } else {
                break;
            }
        }
        if count > SHORT_NUMBER {
            out.push(Span {
                start: i,
                end,
                label: "number",
            });
        }
        i = end;
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn numbers_and_addresses_are_masked_but_not_short_numbers() {
        assert_eq!(
            mask("call +44 7700 900123 or jane.doe@example.com"),
            "call number or address"
        );
        assert_eq!(
            mask("who won the 100 m on the 18th?"),
            "who won the 100 m on the 18th?"
        );
        assert_eq!(mask("account 123456"), "account number");
        assert_eq!(mask("the 10,000 m at 21:10"), "the 10,000 m at 21:10");
        assert_eq!(mask("results of 14/08/2027"), "results of 14/08/2027");
    }

    #[test]
    fn punctuation_next_to_a_number_does_not_hide_it() {
        assert_eq!(mask("my number is 07700900123?"), "my number is number?");
        assert_eq!(mask("\"07700 900123\""), "\"number\"");
        assert_eq!(mask("tel:+447700900123"), "tel:number");
        assert_eq!(mask("ref #12345678."), "ref #number.");
        assert_eq!(mask("(0)7700–900–123"), "number");
    }

    #[test]
    fn card_numbers_are_found_by_the_luhn_check() {
        // Published test card numbers (Luhn, ISO/IEC 7812), from memory.
        assert_eq!(
            mask("paid with 4111-1111-1111-1111 ok"),
            "paid with card ok"
        );
        assert_eq!(mask("5555 5555 5555 4444"), "card");
        assert_eq!(mask("378282246310005"), "card");
        // Fails Luhn: still a long number.
        assert_eq!(mask("4111 1111 1111 1112"), "number");
    }

    #[test]
    fn ibans_are_found_by_the_mod_97_check() {
        // Example IBANs published with ISO 13616 / by national banks,
        // from memory.
        assert_eq!(
            mask("pay GB82 WEST 1234 5698 7654 32 now"),
            "pay account now"
        );
        assert_eq!(mask("DE89370400440532013000"), "account");
        assert_eq!(mask("iban: NL91ABNA0417164300."), "iban: account.");
        assert!(iban_checks("GB82WEST12345698765432"));
        assert!(!iban_checks("GB83WEST12345698765432"));
    }

    #[test]
    fn spelled_and_bracketed_addresses_are_masked() {
        assert_eq!(
            mask("write to jane dot doe at example dot test please"),
            "write to address please"
        );
        assert_eq!(mask("jane(at)example(dot)test"), "address");
        assert_eq!(mask("jane @ example.test"), "address");
        assert_eq!(mask("see www.example.com/a?b=1 now"), "see link now");
        assert_eq!(mask("https://example.test/x."), "link.");
        assert_eq!(mask("go to example dot com"), "go to link");
        // Ordinary uses of the words stay.
        assert_eq!(
            mask("who was at the top at 9.93"),
            "who was at the top at 9.93"
        );
    }

    #[test]
    fn id_shapes_and_spelled_digits_are_masked() {
        assert_eq!(mask("ni AB123456C"), "ni number");
        assert_eq!(mask("850101-1234"), "number");
        assert_eq!(mask("123-45-6789"), "number");
        assert_eq!(mask("seven seven zero zero nine zero"), "number");
        assert_eq!(mask("top three"), "top three");
    }

    #[test]
    fn full_width_digits_are_seen_as_digits() {
        assert_eq!(mask("０７７００９００１２３"), "number");
    }
}
