//! Tests of the voice-reply tools in `tests/common/speech.rs`: the SSML 1.1
//! checker, the eSpeak NG duration measure and the Flesch (1948) score.

mod common;

use common::speech::*;

/// A document around `body` with everything SSML 1.1 requires of the root.
fn speak(body: &str) -> String {
    format!(
        "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n\
         <speak version=\"1.1\" xmlns=\"http://www.w3.org/2001/10/synthesis\" xml:lang=\"en-GB\">{body}</speak>"
    )
}

fn rejected(doc: &str) -> String {
    match check_ssml(doc) {
        Ok(()) => panic!("check_ssml accepted a document it should refuse:\n{doc}"),
        Err(reason) => reason,
    }
}

// ---- Flesch (1948) ----

#[test]
fn flesch_worked_example_from_counts() {
    // "The cat sat on the mat.": 6 words, 1 sentence, 6 syllables.
    // 206.835 - 1.015 * 6 - 84.6 * 1 = 116.145
    assert!((flesch_counts(6, 1, 6) - 116.145).abs() < 1e-9);
}

#[test]
fn flesch_worked_example_from_text() {
    let text = "The cat sat on the mat.";
    let total: usize = text
        .split(|c: char| !c.is_alphabetic())
        .map(syllables)
        .sum();
    assert_eq!(total, 6, "every word of the example is one syllable");
    let score = flesch_reading_ease(&[text]);
    assert!((score - 116.145).abs() < 1e-9, "got {score}");
}

#[test]
fn flesch_adds_up_totals_across_texts() {
    // Two texts: 6 + 2 words, 1 + 1 sentences, 6 + 5 syllables (beau-ti-ful 3,
    // foot-ball 2).
    let score = flesch_reading_ease(&["The cat sat on the mat.", "Beautiful football!"]);
    assert!(
        (score - flesch_counts(8, 2, 11)).abs() < 1e-9,
        "got {score}"
    );
    // Not the average of the two scores.
    let average = (flesch_reading_ease(&["The cat sat on the mat."])
        + flesch_reading_ease(&["Beautiful football!"]))
        / 2.0;
    assert!((score - average).abs() > 1e-6);
}

#[test]
fn flesch_counting_rules() {
    // A hyphenated number is one word; its syllables add up (twen-ty-one: 3).
    // "don't" is one word. A text with no end mark is still one sentence.
    // "2.5" is not a word and its point ends no sentence.
    let score = flesch_reading_ease(&["Twenty-one don't 2.5 count"]);
    // words: twenty-one, don't, count = 3; sentences 1; syllables 3 + 1 + 1 = 5
    assert!((score - flesch_counts(3, 1, 5)).abs() < 1e-9, "got {score}");
    // Runs of end marks end one sentence.
    let score = flesch_reading_ease(&["What a goal?! Yes..."]);
    assert!((score - flesch_counts(4, 2, 4)).abs() < 1e-9, "got {score}");
    assert!(flesch_reading_ease(&["", "3-1"]).is_nan());
}

#[test]
fn syllables_match_dictionary_hyphenation() {
    // Hyphenation as printed in Merriam-Webster's dictionary entries, from
    // memory (the centred dots split these words into their syllables).
    let cases = [
        ("the", 1),        // the
        ("cat", 1),        // cat
        ("one", 1),        // one
        ("scored", 1),     // scored
        ("played", 1),     // played
        ("games", 1),      // games
        ("football", 2),   // foot·ball
        ("season", 2),     // sea·son
        ("minute", 2),     // min·ute
        ("table", 2),      // ta·ble
        ("little", 2),     // lit·tle
        ("wanted", 2),     // want·ed
        ("matches", 2),    // match·es
        ("against", 2),    // a·gainst
        ("fixture", 2),    // fix·ture
        ("goalkeeper", 3), // goal·keep·er
        ("referee", 3),    // ref·er·ee
        ("penalty", 3),    // pen·al·ty
        ("victory", 3),    // vic·to·ry
        ("tournament", 3), // tour·na·ment
        ("yesterday", 3),  // yes·ter·day
        ("Saturday", 3),   // Sat·ur·day
        ("beautiful", 3),  // beau·ti·ful
        ("united", 3),     // u·nit·ed
        ("twenty-one", 3), // twen·ty-one
    ];
    let wrong: Vec<String> = cases
        .iter()
        .filter(|(w, n)| syllables(w) != *n)
        .map(|(w, n)| format!("{w}: expected {n}, counted {}", syllables(w)))
        .collect();
    assert!(wrong.is_empty(), "{wrong:#?}");
    assert_eq!(syllables(""), 0);
    assert_eq!(syllables("hmm"), 1, "a word has at least one syllable");
}

// ---- SSML 1.1 ----

#[test]
fn ssml_accepts_a_minimal_document() {
    check_ssml(&speak("Arsenal won two nil.")).unwrap();
    check_ssml(
        r#"<speak version="1.1" xmlns="http://www.w3.org/2001/10/synthesis" xml:lang="en"/>"#,
    )
    .unwrap();
}

#[test]
fn ssml_accepts_defined_elements_and_attributes() {
    check_ssml(&speak(
        r#"<p><s>On <say-as interpret-as="date" format="dmy">14/08/2027</say-as>
           <emphasis level="strong">Lisbon</emphasis> won
           <break time="250ms"/> <break strength="x-strong"/> <break time="1s"/> <break time="0.5s"/>
           <say-as interpret-as="ordinal">1</say-as> place,
           <say-as interpret-as="time" format="hm24">21:10</say-as>,
           <say-as interpret-as="characters">BBC</say-as>
           <sub alias="metres">m</sub> <prosody rate="slow" volume="loud">slowly</prosody>
           <phoneme alphabet="ipa" ph="təˈmɑːtəʊ">tomato</phoneme>
           <lang xml:lang="fr-FR">bonjour</lang> <w role="x">word</w>
           <mark name="end"/></s></p>"#,
    ))
    .unwrap();
}

#[test]
fn ssml_rejects_wrong_version() {
    let reason = rejected(
        r#"<speak version="1.0" xmlns="http://www.w3.org/2001/10/synthesis" xml:lang="en">Hi.</speak>"#,
    );
    assert!(reason.contains("version"), "{reason}");
    let reason =
        rejected(r#"<speak xmlns="http://www.w3.org/2001/10/synthesis" xml:lang="en">Hi.</speak>"#);
    assert!(reason.contains("version"), "{reason}");
}

#[test]
fn ssml_rejects_missing_namespace() {
    let reason = rejected(r#"<speak version="1.1" xml:lang="en">Hi.</speak>"#);
    assert!(reason.contains("namespace"), "{reason}");
}

#[test]
fn ssml_rejects_missing_xml_lang() {
    let reason =
        rejected(r#"<speak version="1.1" xmlns="http://www.w3.org/2001/10/synthesis">Hi.</speak>"#);
    assert!(reason.contains("xml:lang"), "{reason}");
}

#[test]
fn ssml_rejects_unknown_element() {
    let reason = rejected(&speak("Hi <foo/> there."));
    assert!(reason.contains("<foo>"), "{reason}");
}

#[test]
fn ssml_rejects_unknown_attribute_on_break() {
    let reason = rejected(&speak(r#"Hi <break duration="1s"/> there."#));
    assert!(
        reason.contains("duration") && reason.contains("<break>"),
        "{reason}"
    );
}

#[test]
fn ssml_rejects_bad_break_values() {
    let reason = rejected(&speak(r#"Hi <break time="1 second"/> there."#));
    assert!(reason.contains("time"), "{reason}");
    let reason = rejected(&speak(r#"Hi <break strength="huge"/> there."#));
    assert!(reason.contains("strength"), "{reason}");
}

#[test]
fn ssml_rejects_bad_say_as_interpret_as() {
    let reason = rejected(&speak(r#"<say-as interpret-as="ordinally">1</say-as>"#));
    assert!(reason.contains("ordinally"), "{reason}");
    let reason = rejected(&speak(
        r#"<say-as interpret-as="date" format="yyyymmdd">20270814</say-as>"#,
    ));
    assert!(reason.contains("yyyymmdd"), "{reason}");
}

#[test]
fn ssml_rejects_malformed_xml() {
    let reason = rejected(&speak("Smith & Co won."));
    assert!(reason.contains("XML"), "{reason}");
}

#[test]
fn ssml_accepts_escaped_markup_as_text() {
    // Escaped, this is text to be read, not a break element.
    check_ssml(&speak(r#"Smith &lt;break time="9s"/&gt; &amp; Co"#)).unwrap();
}

// ---- eSpeak NG ----

const SENTENCE: &str = "The match ended two nil.";

fn espeak(ssml: &str) -> f64 {
    espeak_seconds(ssml).unwrap_or_else(|e| {
        panic!("{e}\n(these tests need espeak-ng: run `bash tests/run.sh`, which installs it)")
    })
}

#[test]
fn espeak_renders_a_sentence() {
    let secs = espeak(&speak(SENTENCE));
    assert!(secs > 0.0, "rendered {secs} s");
}

#[test]
fn espeak_honours_a_break() {
    // The same sentence with a 500 ms break inside it: if espeak-ng reads the
    // markup, the audio is about half a second longer.
    let plain = espeak(&speak(SENTENCE));
    let with_break = espeak(&speak("The match ended <break time=\"500ms\"/> two nil."));
    let diff = with_break - plain;
    eprintln!("plain {plain:.4} s, with break {with_break:.4} s, difference {diff:.4} s");
    assert!(
        (0.35..=0.75).contains(&diff),
        "a 500 ms break added {diff:.3} s ({plain:.3} s -> {with_break:.3} s)"
    );
}
