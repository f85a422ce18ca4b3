//! Personal data in readers' messages never reaches what is kept: a
//! property test over generated shapes (phone numbers, card numbers, IBANs,
//! e-mail addresses written and spelled out, id numbers), each wrapped in
//! punctuation and placed in a question.

mod common;

use proptest::prelude::*;
use tidings::privacy::{iban_checks, luhn_checks, mask};

/// The Luhn check digit (ISO/IEC 7812-1) that completes `body`.
fn luhn_complete(body: &str) -> String {
    (0..10)
        .map(|d| format!("{body}{d}"))
        .find(|n| luhn_checks(n))
        .expect("one digit completes any body")
}

/// The IBAN with the check digits of ISO 13616 for `country` and `bban`:
/// 98 minus the remainder of `bban country 00` mod 97.
fn iban(country: &str, bban: &str) -> String {
    let moved = format!("{bban}{country}00");
    let mut rem = 0u32;
    for c in moved.chars() {
        let v = c.to_digit(36).unwrap();
        rem = if v >= 10 {
            (rem * 100 + v) % 97
        } else {
            (rem * 10 + v) % 97
        };
    }
    format!("{country}{:02}{bban}", 98 - rem)
}

/// Digits split into groups of 2 to 4 with one separator between them.
fn grouped(digits: String, seps: Vec<&'static str>) -> String {
    let mut out = String::new();
    for (i, c) in digits.chars().enumerate() {
        if i > 0 && i % 3 == 0 {
            out.push_str(seps[(i / 3) % seps.len()]);
        }
        out.push(c);
    }
    out
}

fn separator() -> impl Strategy<Value = &'static str> {
    prop::sample::select(vec!["", " ", "-", ".", "/", " - ", "–"])
}

/// A piece of personal data and the digits or words that must not survive.
#[derive(Debug, Clone)]
struct Pii {
    text: String,
    secrets: Vec<String>,
}

fn phone() -> impl Strategy<Value = Pii> {
    (
        prop::sample::select(vec!["", "+44 ", "+351 ", "(0)", "+1 (555) ", "00 33 "]),
        "[1-9][0-9]{6,10}",
        prop::collection::vec(separator(), 1..4),
    )
        .prop_map(|(lead, digits, seps)| Pii {
            text: format!("{lead}{}", grouped(digits.clone(), seps)),
            secrets: vec![digits],
        })
}

fn card() -> impl Strategy<Value = Pii> {
    ("[3-6][0-9]{14}", prop::sample::select(vec!["", " ", "-"])).prop_map(|(body, sep)| {
        let n = luhn_complete(&body);
        let text = n
            .as_bytes()
            .chunks(4)
            .map(|c| std::str::from_utf8(c).unwrap())
            .collect::<Vec<_>>()
            .join(sep);
        Pii {
            text,
            secrets: vec![n],
        }
    })
}

fn an_iban() -> impl Strategy<Value = Pii> {
    (
        prop::sample::select(vec!["GB", "DE", "NL", "PT", "FR"]),
        "[A-Z]{4}[0-9]{14}",
        any::<bool>(),
    )
        .prop_map(|(country, bban, spaced)| {
            let i = iban(country, &bban);
            assert!(iban_checks(&i), "{i}");
            let text = if spaced {
                i.as_bytes()
                    .chunks(4)
                    .map(|c| std::str::from_utf8(c).unwrap())
                    .collect::<Vec<_>>()
                    .join(" ")
            } else {
                i.clone()
            };
            Pii {
                text,
                secrets: vec![bban[4..].to_string()],
            }
        })
}

fn email() -> impl Strategy<Value = Pii> {
    (
        "[a-z]{3,8}",
        "[a-z]{3,8}",
        "[a-z]{4,9}",
        prop::sample::select(vec!["test", "com", "org", "example"]),
        0..4usize,
    )
        .prop_map(|(first, last, domain, tld, form)| {
            let text = match form {
                0 => format!("{first}.{last}@{domain}.{tld}"),
                1 => format!("{first}.{last} @ {domain}.{tld}"),
                2 => format!("{first} dot {last} at {domain} dot {tld}"),
                _ => format!("{first}{last}(at){domain}(dot){tld}"),
            };
            Pii {
                text,
                secrets: vec![format!("{first}"), format!("{domain}")],
            }
        })
}

fn id_number() -> impl Strategy<Value = Pii> {
    ("[a-z]{2}", "[0-9]{6}", "[a-d]").prop_map(|(a, d, c)| Pii {
        text: format!("{a}{d}{c}"),
        secrets: vec![d],
    })
}

fn pii() -> impl Strategy<Value = Pii> {
    prop_oneof![phone(), card(), an_iban(), email(), id_number()]
}

fn wrapped() -> impl Strategy<Value = (String, Pii)> {
    (
        pii(),
        prop::sample::select(vec![
            ("", ""),
            ("\"", "\""),
            ("tel:", ""),
            ("#", ""),
            ("(", ")"),
            ("", "?"),
            ("", "."),
            ("", ","),
            ("<", ">"),
            ("'", "'"),
        ]),
        prop::sample::select(vec![
            "who won the 100 m? my number is {}",
            "{} did Dosavorn win",
            "text me at {} about the final",
            "card {} please",
            "results for {}",
        ]),
    )
        .prop_map(|(p, (open, close), template)| {
            let wrapped = format!("{open}{}{close}", p.text);
            (template.replace("{}", &wrapped), p)
        })
}

/// The longest run of digits in `s`.
fn longest_digit_run(s: &str) -> usize {
    s.split(|c: char| !c.is_ascii_digit())
        .map(str::len)
        .max()
        .unwrap_or(0)
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(2000))]

    #[test]
    fn no_generated_personal_data_survives_masking((message, p) in wrapped()) {
        let kept = mask(&message);
        // What the unanswered list keeps is the normalised form.
        let normalised = tidings::understand::normalize::normalize(&kept);
        for form in [&kept, &normalised] {
            prop_assert!(longest_digit_run(form) <= 5, "{message:?} -> {form:?}");
            prop_assert!(!form.contains('@'), "{message:?} -> {form:?}");
            let squashed: String = form.chars().filter(|c| c.is_alphanumeric()).collect();
            for secret in &p.secrets {
                let secret = secret.to_lowercase();
                let in_template = ["who", "won", "the", "my", "number", "did", "dosavorn", "win", "text", "me", "at", "about", "final", "card", "please", "results", "for"].iter().any(|w| w.contains(secret.as_str()) || secret.contains(w));
                if !in_template {
                    prop_assert!(!squashed.contains(&secret), "{secret:?} kept: {message:?} -> {form:?}");
                }
            }
        }
    }

    #[test]
    fn masking_twice_changes_nothing((message, _) in wrapped()) {
        let once = mask(&message);
        prop_assert_eq!(mask(&once), once.clone());
    }

    #[test]
    fn questions_without_personal_data_are_kept_as_they_are(
        q in prop::sample::select(vec![
            "who won the men's 100 m?",
            "the 10,000 m on the 18th at 21:10",
            "medals for quessary in 2027",
            "did she beat 9.93 s in heat 2",
            "what is on on 14/08/2027",
            "top three in the 4x100m relay",
            "who was at the top at the end",
        ])
    ) {
        prop_assert_eq!(mask(q), q.to_lowercase());
    }
}

#[test]
fn the_published_example_ibans_and_test_cards_pass_their_checks() {
    // ISO 13616 mod-97; example IBANs as published by the issuing
    // countries' banks, from memory.
    for i in [
        "GB82WEST12345698765432",
        "DE89370400440532013000",
        "NL91ABNA0417164300",
        "FR1420041010050500013M02606",
    ] {
        assert!(iban_checks(i), "{i}");
    }
    // Luhn, ISO/IEC 7812; card schemes' published test numbers, from memory.
    for c in [
        "4111111111111111",
        "5555555555554444",
        "378282246310005",
        "6011111111111117",
    ] {
        assert!(luhn_checks(c), "{c}");
    }
    assert!(!luhn_checks("4111111111111112"));
}

/// Through the whole service: what a reader wrote is kept masked on the
/// unanswered list, counted once per reader, and goes when they are erased.
#[tokio::test]
async fn the_unanswered_list_keeps_masked_words_and_forgets_an_erased_reader() {
    let engine = common::demo_engine();
    let probes = [
        "my number is +351 912 345 678?",
        "pay \"DE89 3704 0044 0532 0130 00\" now",
        "card 4111-1111-1111-1111 thanks",
        "mail jane dot doe at example dot test",
        "tel:07700900123",
    ];
    for text in probes {
        engine.handle("reader-pii", "sms", text).await.unwrap();
        // Asked again by the same reader: still one reader.
        engine.handle("reader-pii", "sms", text).await.unwrap();
    }
    common::wait_until(
        "the list to fill",
        std::time::Duration::from_secs(10),
        || {
            let engine = &engine;
            async move { engine.unanswered(100).await.unwrap().len() >= probes.len() }
        },
    )
    .await;
    let rows = engine.unanswered(100).await.unwrap();
    let all = format!("{rows:?}");
    for secret in ["912", "3704", "4111", "jane", "7700"] {
        assert!(!all.contains(secret), "{secret} kept: {all}");
    }
    assert!(rows.iter().all(|r| r.count == 1), "{all}");
    engine.erase("sms", "reader-pii").await.unwrap();
    assert!(engine.unanswered(100).await.unwrap().is_empty());
}
