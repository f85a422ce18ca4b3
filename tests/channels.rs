//! Every channel against the eval set's conversations and the standards:
//! one SMS segment (3GPP TS 23.038), SSML 1.1 spoken by a real engine,
//! readability of voice replies (Flesch 1948), quick replies that are real
//! questions, and a snapshot of each channel's output for every intent.

mod common;

use std::collections::BTreeMap;
use std::path::Path;

use common::{demo_engine, speech, Server};
use tidings::answers::sms;
use tidings::engine::{Answer, Engine};
use tidings::eval::{load_set, Case};

/// The games eval set.
const GAMES: &str = "tests/eval/games.yaml";
/// The election eval set (run at 01:45 of the replayed night).
const ELECTION: &str = "tests/eval/election.yaml";

/// An eval set's conversations, each as its list of messages.
fn conversations(set: &str) -> Vec<Vec<String>> {
    let set =
        load_set(&Path::new(env!("CARGO_MANIFEST_DIR")).join(set)).expect("the eval set loads");
    set.into_iter()
        .map(|c| match c {
            Case::Single(t) => vec![t.ask],
            Case::Conversation { conversation, .. } => {
                conversation.into_iter().map(|t| t.ask).collect()
            }
        })
        .collect()
}

/// Every reply of the eval set on one channel, each conversation by its
/// own reader.
async fn replies_on(engine: &Engine, set: &str, channel: &str) -> Vec<(String, Answer)> {
    let mut out = Vec::new();
    for (i, conv) in conversations(set).into_iter().enumerate() {
        let user = format!("{channel}-reader-{i}");
        for ask in conv {
            let a = engine
                .handle(&user, channel, &ask)
                .await
                .unwrap_or_else(|e| panic!("{channel}: {ask:?}: {e}"));
            assert!(
                !a.reply.text.trim().is_empty(),
                "{channel}: {ask:?}: empty reply"
            );
            out.push((ask, a));
        }
    }
    out
}

#[tokio::test]
async fn every_sms_reply_fits_one_segment() {
    let engine = demo_engine();
    let replies = replies_on(&engine, GAMES, "sms").await;
    let mut ucs2 = 0;
    let mut too_long = Vec::new();
    for (ask, a) in &replies {
        let m = sms::measure(&a.reply.text);
        // 3GPP TS 23.038 §6.2.1 (default alphabet and extension table) and
        // TS 23.040: one segment is 160 septets, or 70 UCS-2 characters.
        if !m.fits_one_segment() {
            too_long.push(format!(
                "{ask:?} → {:?} takes {} units of {}",
                a.reply.text, m.units, m.limit
            ));
        }
        let fit = a
            .sms
            .as_ref()
            .expect("the sms channel reports its encoding");
        assert_eq!((fit.units, fit.limit), (m.units, m.limit));
        if m.encoding == sms::Encoding::Ucs2 {
            ucs2 += 1;
        }
    }
    assert!(too_long.is_empty(), "{}", too_long.join("\n"));
    // Shorter wording is chosen, never a cut: every word of an SMS is a
    // word of the same reply on the plain channel, or one of the SMS
    // profile's shorter forms, or the "N more" of a shortened list. Words
    // are compared without diacritics: a name may be transliterated into
    // the GSM alphabet ("Zoë" → "Zoe") when its letter would make the reply
    // UCS-2 and too long.
    let plain = replies_on(&engine, GAMES, "plain").await;
    let words = |t: &str| -> Vec<String> {
        t.split(|c: char| !(c.is_alphanumeric() || c == '\'' || c == '’'))
            .filter(|w| !w.is_empty())
            .map(tidings::understand::normalize::normalize)
            .collect()
    };
    let short_forms = [
        "w", "m", "im", "free", "fly", "breast", "now", "next", "more", "v",
    ];
    let snap = engine.snapshot();
    // Wording an editor wrote for SMS is checked by the segment rule above,
    // not against the derived wording.
    let own_wording = |a: &Answer| match (&a.reply.intent, &a.reply.detail) {
        (Some(i), Some(d)) => snap.catalog.intent(i).is_some_and(|i| {
            i.channel_replies
                .get("sms")
                .is_some_and(|m| m.contains_key(d))
        }),
        _ => !a.reply.options.is_empty() && snap.catalog.service.by_channel.contains_key("sms"),
    };
    let mut checked = 0;
    for ((ask, a), (_, p)) in replies.iter().zip(&plain) {
        if own_wording(a) {
            continue;
        }
        checked += 1;
        let allowed = words(&p.reply.text);
        for w in words(&a.reply.text) {
            assert!(
                allowed.contains(&w)
                    || short_forms.contains(&w.as_str())
                    || w.parse::<u32>().is_ok(),
                "{ask:?}: sms word {w:?} is not in the plain reply {:?} (sms {:?})",
                p.reply.text,
                a.reply.text
            );
        }
    }
    assert!(checked > 400, "only {checked} replies compared");
    eprintln!("{} sms replies, {ucs2} in UCS-2", replies.len());
}

#[tokio::test]
async fn every_voice_reply_is_valid_ssml_and_readable() {
    let engine = demo_engine();
    let replies = replies_on(&engine, GAMES, "voice").await;
    let mut texts = Vec::new();
    for (ask, a) in &replies {
        let doc = a.reply.ssml.as_deref().expect("voice replies carry SSML");
        if let Err(e) = speech::check_ssml(doc) {
            panic!("{ask:?}: {e}\n{doc}");
        }
        // No symbol a speech engine would read oddly in the spoken text.
        let odd = odd_symbols(&a.reply.text);
        assert!(odd.is_empty(), "{ask:?} → {:?} has {odd:?}", a.reply.text);
        texts.push(a.reply.text.clone());
    }
    // Flesch Reading Ease (Flesch 1948) over all voice replies together.
    let refs: Vec<&str> = texts.iter().map(String::as_str).collect();
    let score = speech::flesch_reading_ease(&refs);
    eprintln!(
        "Flesch reading ease of {} voice replies: {score:.1}",
        texts.len()
    );
    assert!(score >= 60.0, "voice replies read at {score:.1}, below 60");
}

#[tokio::test]
async fn every_distinct_voice_reply_is_spoken_by_a_real_engine() {
    let engine = demo_engine();
    let mut docs: Vec<String> = replies_on(&engine, GAMES, "voice")
        .await
        .into_iter()
        .filter_map(|(_, a)| a.reply.ssml)
        .collect();
    docs.sort();
    docs.dedup();
    for doc in &docs {
        let secs = speech::espeak_seconds(doc).unwrap_or_else(|e| panic!("{e}\n{doc}"));
        assert!(secs > 0.0, "no audio for {doc}");
    }
    eprintln!("{} distinct voice replies spoken by espeak-ng", docs.len());
}

/// The SSML says what the text says: espeak-ng's phonemes for the document
/// and for the reply's spoken text are the same, for every distinct voice
/// reply. This catches markup an engine reads differently from the text
/// ("2" in an ordinal said "two").
#[tokio::test]
async fn every_voice_document_sounds_like_its_text() {
    let engine = demo_engine();
    let mut pairs: Vec<(String, String)> = replies_on(&engine, GAMES, "voice")
        .await
        .into_iter()
        .map(|(_, a)| (a.reply.text, a.reply.ssml.unwrap_or_default()))
        .collect();
    assert_sound_like_their_text(&mut pairs);
}

#[tokio::test]
async fn quick_replies_are_questions_the_service_answers() {
    let engine = demo_engine();
    let mut offered = 0;
    for (i, conv) in conversations(GAMES).into_iter().enumerate() {
        let user = format!("quick-{i}");
        for ask in conv {
            let a = engine.handle(&user, "chat", &ask).await.unwrap();
            assert!(a.reply.quick_replies.len() <= 3);
            for q in &a.reply.quick_replies {
                // Sent by a reader of its own right after the same answer.
                let probe = format!("{user}-probe-{offered}");
                engine.handle(&probe, "chat", &ask).await.unwrap();
                let b = engine.handle(&probe, "chat", q).await.unwrap();
                let outcome = serde_json::to_value(b.reply.outcome).unwrap();
                assert!(
                    outcome == "answered" || outcome == "no_data",
                    "quick reply {q:?} after {ask:?} → {outcome}: {}",
                    b.reply.text
                );
                offered += 1;
            }
        }
    }
    assert!(offered > 50, "only {offered} quick replies were offered");
}

/// The election night's replies at 01:45 on SMS and voice: one segment
/// each (3GPP TS 23.038 and TS 23.040), valid SSML 1.1 with nothing a
/// speech engine would read oddly in the spoken text, and for every
/// distinct document the same phonemes from espeak-ng as for its text.
#[tokio::test]
async fn election_replies_fit_one_sms_and_speak_as_written() {
    let engine = common::election_engine(common::ELECTION_BATCHES, common::ELECTION_NOW).await;
    let mut too_long = Vec::new();
    for (ask, a) in replies_on(&engine, ELECTION, "sms").await {
        let m = sms::measure(&a.reply.text);
        if !m.fits_one_segment() {
            too_long.push(format!(
                "{ask:?} → {:?} takes {} of {}",
                a.reply.text, m.units, m.limit
            ));
        }
    }
    assert!(too_long.is_empty(), "{}", too_long.join("\n"));
    let voice = replies_on(&engine, ELECTION, "voice").await;
    let mut pairs = Vec::new();
    for (ask, a) in voice {
        let doc = a.reply.ssml.clone().expect("voice replies carry SSML");
        if let Err(e) = speech::check_ssml(&doc) {
            panic!("{ask:?}: {e}\n{doc}");
        }
        let odd = odd_symbols(&a.reply.text);
        assert!(odd.is_empty(), "{ask:?} → {:?} has {odd:?}", a.reply.text);
        pairs.push((a.reply.text, doc));
    }
    assert_sound_like_their_text(&mut pairs);
    eprintln!(
        "{} distinct election voice replies sound like their text",
        pairs.len()
    );
}

/// Symbols and figures a speech engine would read oddly in spoken text.
fn odd_symbols(text: &str) -> Vec<char> {
    text.chars()
        .filter(|c| "()[]{}<>*#/\\|_~^@&%\"“”".contains(*c) || c.is_ascii_digit())
        .collect()
}

/// espeak-ng's phonemes for each distinct (text, SSML document) pair are
/// the same for the document as for the text; every pair that differs is
/// described on failure.
fn assert_sound_like_their_text(pairs: &mut Vec<(String, String)>) {
    pairs.sort();
    pairs.dedup();
    let mut differ = Vec::new();
    for (text, doc) in pairs.iter() {
        let said = speech::espeak_phonemes(doc, true).unwrap();
        let written = speech::espeak_phonemes(text, false).unwrap();
        if said != written {
            differ.push(format!(
                "{text}\n  {doc}\n  ssml: {said}\n  text: {written}"
            ));
        }
    }
    assert!(
        differ.is_empty(),
        "{} of {}:\n{}",
        differ.len(),
        pairs.len(),
        differ.join("\n")
    );
}

/// One question per intent, for the snapshots.
const PER_INTENT: [(&str, &str); 21] = [
    ("podium", "who won the women's 200 m freestyle?"),
    ("medalist", "who got bronze in the men's 400 m?"),
    (
        "competitor_result",
        "how did Zoë Quillon do in the women's 100 m freestyle?",
    ),
    ("competitor_profile", "tell me about Wonorin Galkace"),
    (
        "competitor_medals",
        "how many medals has Hurra Brussand won?",
    ),
    ("competitor_next", "when does Zoë Quillon compete next?"),
    ("delegation_medals", "how many medals has Quessary won?"),
    ("medal_table_top", "show me the medal table"),
    ("medal_table_leader", "who leads the medal table?"),
    ("most_medals", "which delegation has the most medals?"),
    ("contest_time", "when is the women's 100 m final?"),
    ("schedule_day", "what's on tomorrow?"),
    ("live_leader", "who is leading the men's marathon?"),
    ("head_to_head", "did Lirust Dosavorn beat Bandan Zorvren?"),
    ("best_mark", "what is the best long jump so far?"),
    ("full_results", "full results of the women's 400 m"),
    ("under_way", "what's on right now?"),
    (
        "delegation_in_event",
        "how did Kalvenmark do in the men's 100 m final?",
    ),
    ("greeting", "hello"),
    ("thanks", "thanks"),
    ("help", "what can you do?"),
];

/// Every intent on every channel through HTTP, as a client sees it.
#[tokio::test]
async fn each_channel_phrases_every_intent() {
    let server = Server::start(demo_engine()).await;
    let mut seen = BTreeMap::new();
    for (intent, ask) in PER_INTENT {
        let mut shown = String::new();
        for channel in ["chat", "sms", "voice", "plain"] {
            let r = server
                .client
                .post(server.url("/v1/messages"))
                // With the explanation: the library's `Answer`, read back
                // here, is the whole answer.
                .json(&serde_json::json!({
                    "user": format!("snap-{intent}-{channel}"), "text": ask, "channel": channel,
                    "explain": true
                }))
                .send()
                .await
                .unwrap();
            assert_eq!(r.status(), 200, "{ask:?} on {channel}");
            let a: Answer = r.json().await.unwrap();
            assert_eq!(
                a.reply.intent.as_deref(),
                Some(intent),
                "{ask:?} on {channel}"
            );
            shown.push_str(&format!("[{channel}] {}\n", a.reply.text));
            if let Some(m) = &a.reply.markdown {
                shown.push_str(&format!("[{channel} markdown] {m}\n"));
            }
            if !a.reply.quick_replies.is_empty() {
                shown.push_str(&format!(
                    "[{channel} quick replies] {}\n",
                    a.reply.quick_replies.join(" | ")
                ));
            }
            if let Some(s) = &a.reply.ssml {
                shown.push_str(&format!("[{channel} ssml] {s}\n"));
            }
            if let Some(f) = &a.sms {
                shown.push_str(&format!(
                    "[{channel} encoding] {} {}/{}\n",
                    f.encoding, f.units, f.limit
                ));
            }
        }
        seen.insert(intent, shown);
    }
    for (intent, shown) in seen {
        insta::assert_snapshot!(intent, shown);
    }
}

/// A name from the data that looks like markup is spoken as text: the
/// winner of the men's 100 m renamed `<break time="9s"/> & Co` must not
/// make the engine pause for nine seconds (XML 1.0 §2.4 escaping).
#[tokio::test]
async fn markup_in_the_data_is_escaped_in_ssml() {
    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("dataset-demo/games");
    let dir = std::env::temp_dir().join(format!(
        "tidings-markup-{}-{:08x}",
        std::process::id(),
        rand::random::<u32>()
    ));
    std::fs::create_dir_all(&dir).unwrap();
    for f in std::fs::read_dir(&root).unwrap().flatten() {
        std::fs::copy(f.path(), dir.join(f.file_name())).unwrap();
    }
    let path = dir.join("competitors.json");
    let mut people: serde_json::Value =
        serde_json::from_str(&std::fs::read_to_string(&path).unwrap()).unwrap();
    for p in people.as_array_mut().unwrap() {
        if p["id"] == "p005" {
            p["family"] = serde_json::json!("<break time=\"9s\"/> & Co");
        }
    }
    std::fs::write(&path, serde_json::to_string(&people).unwrap()).unwrap();
    let snap = tidings::engine::load(&tidings::engine::Sources {
        data: Some(dir.clone()),
        intents: None,
    })
    .expect("the renamed data loads");
    let engine = common::engine_with(
        std::sync::Arc::new(tidings::dialogue::MemoryStore::new()),
        common::test_settings(),
    );
    engine.swap(snap);
    let a = engine
        .handle("markup", "voice", "who won the men's 100 m final?")
        .await
        .unwrap();
    let doc = a.reply.ssml.unwrap();
    speech::check_ssml(&doc).unwrap_or_else(|e| panic!("{e}\n{doc}"));
    assert!(doc.contains("&lt;break time"), "{doc}");
    assert!(!doc.contains("<break time=\"9s\""), "{doc}");
    // Against the same reply with the original name: a pause read as
    // markup would add nine seconds; the name read as words adds little.
    let plain = demo_engine()
        .handle("markup", "voice", "who won the men's 100 m final?")
        .await
        .unwrap();
    let base = speech::espeak_seconds(&plain.reply.ssml.unwrap()).unwrap();
    let secs = speech::espeak_seconds(&doc).unwrap();
    assert!(
        secs - base < 4.0,
        "the name was read as a pause: {secs:.2} s against {base:.2} s"
    );
    let _ = std::fs::remove_dir_all(&dir);
}
