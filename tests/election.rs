//! The election night end to end: a real `tidings serve` on the election
//! scenario, the night's batches fed to it by the real `tidings replay`,
//! and readers' questions asked at several points of the night. Every
//! expected figure is worked out here from the batch files themselves (the
//! state at that moment), not taken from the service.

mod common;

use std::collections::BTreeMap;
use std::path::{Path, PathBuf};
use std::process::Command;
use std::time::{Duration, Instant};

use common::{ask_at, ask_on, ServeProcess};
use serde_json::Value;

const TOKEN: &str = "election-night-token-0123456789";

fn root() -> &'static Path {
    Path::new(env!("CARGO_MANIFEST_DIR"))
}

fn read_json(p: &Path) -> Value {
    serde_json::from_str(&std::fs::read_to_string(p).unwrap()).unwrap()
}

/// The night's batch files, in the order the replay plays them.
fn batch_files() -> Vec<PathBuf> {
    let mut v: Vec<PathBuf> = std::fs::read_dir(root().join("dataset-demo/election/replay"))
        .unwrap()
        .map(|e| e.unwrap().path())
        .filter(|p| p.extension().is_some_and(|x| x == "json"))
        .collect();
    v.sort();
    v
}

/// One ward as the test itself sees it after the batches so far.
#[derive(Debug, Clone)]
struct Ward {
    name: String,
    status: String,
    counted: Option<f64>,
    /// (candidate id, place, votes), best first.
    entries: Vec<(String, u32, u64)>,
}

/// The state of the night, rebuilt from the files.
struct Truth {
    wards: BTreeMap<String, Ward>,
    /// Candidate id → (full name, party id).
    people: BTreeMap<String, (String, String)>,
    /// Party id → name.
    parties: BTreeMap<String, String>,
}

impl Truth {
    fn start() -> Truth {
        let dir = root().join("dataset-demo/election");
        let sports = read_json(&dir.join("sports.json"));
        let names: BTreeMap<String, String> = sports[0]["disciplines"]
            .as_array()
            .unwrap()
            .iter()
            .map(|d| {
                (
                    d["id"].as_str().unwrap().to_string(),
                    d["name"].as_str().unwrap().to_string(),
                )
            })
            .collect();
        let wards = read_json(&dir.join("contests.json"))
            .as_array()
            .unwrap()
            .iter()
            .map(|c| {
                let id = c["id"].as_str().unwrap().to_string();
                let ward = Ward {
                    name: names[c["discipline"].as_str().unwrap()].clone(),
                    status: c["status"].as_str().unwrap().to_string(),
                    counted: c["counted"].as_f64(),
                    entries: Vec::new(),
                };
                (id, ward)
            })
            .collect();
        let people = read_json(&dir.join("competitors.json"))
            .as_array()
            .unwrap()
            .iter()
            .map(|p| {
                (
                    p["id"].as_str().unwrap().to_string(),
                    (
                        format!(
                            "{} {}",
                            p["given"].as_str().unwrap(),
                            p["family"].as_str().unwrap()
                        ),
                        p["group"].as_str().unwrap().to_string(),
                    ),
                )
            })
            .collect();
        let parties = read_json(&dir.join("groups.json"))
            .as_array()
            .unwrap()
            .iter()
            .map(|g| {
                (
                    g["id"].as_str().unwrap().to_string(),
                    g["name"].as_str().unwrap().to_string(),
                )
            })
            .collect();
        Truth {
            wards,
            people,
            parties,
        }
    }

    /// Applies one batch file the way the night's feed means it.
    fn apply(&mut self, batch: &Value) {
        for ch in batch["changes"].as_array().unwrap() {
            assert_eq!(ch["change"], "results", "the replay only carries results");
            let w = self.wards.get_mut(ch["contest"].as_str().unwrap()).unwrap();
            if let Some(s) = ch["status"].as_str() {
                w.status = s.to_string();
            }
            if let Some(c) = ch["counted"].as_f64() {
                w.counted = Some(c);
            }
            if let Some(es) = ch["entries"].as_array() {
                w.entries = es
                    .iter()
                    .map(|e| {
                        let votes: u64 = e["mark"]
                            .as_str()
                            .unwrap()
                            .replace(',', "")
                            .parse()
                            .unwrap();
                        (
                            e["competitor"].as_str().unwrap().to_string(),
                            e["place"].as_u64().unwrap() as u32,
                            votes,
                        )
                    })
                    .collect();
                w.entries.sort_by_key(|e| e.1);
            }
        }
    }

    fn ward(&self, id: &str) -> &Ward {
        &self.wards[id]
    }

    fn person(&self, id: &str) -> (&str, &str) {
        let (name, party) = &self.people[id];
        (name, &self.parties[party])
    }

    /// Seats won by each party (name → count) among called races.
    fn seats(&self) -> BTreeMap<String, u64> {
        let mut out = BTreeMap::new();
        for w in self.wards.values().filter(|w| w.status == "final") {
            let (_, party) = self.person(&w.entries[0].0);
            *out.entry(party.to_string()).or_default() += 1;
        }
        out
    }
}

/// Figures as the newsroom writes them: "1,154".
fn thousands(n: u64) -> String {
    let s = n.to_string();
    let mut out = String::new();
    for (i, c) in s.chars().enumerate() {
        if i > 0 && (s.len() - i).is_multiple_of(3) {
            out.push(',');
        }
        out.push(c);
    }
    out
}

/// Counts in running text: words to nine, figures from 10 (common
/// newsroom practice).
fn count(n: u64, noun: &str) -> String {
    const WORDS: [&str; 10] = [
        "zero", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine",
    ];
    let num = if n < 10 {
        WORDS[n as usize].to_string()
    } else {
        thousands(n)
    };
    format!("{num} {noun}{}", if n == 1 { "" } else { "s" })
}

/// A share of `total` in per cent to one decimal, rounded half up, in
/// whole-number arithmetic: "43.8%".
fn share(votes: u64, total: u64) -> String {
    let tenths = (votes * 2000 + total) / (2 * total);
    format!("{}.{}%", tenths / 10, tenths % 10)
}

/// How much is counted, in whole per cent rounded down: "60%".
fn counted(c: f64) -> String {
    format!("{}%", (c * 100.0 + 1e-9).floor() as u64)
}

/// A `tidings serve` of the test's own on the election scenario, at the
/// start of the night, with the admin API on.
fn election_server() -> ServeProcess {
    let data = root().join("dataset-demo/election");
    let intents = root().join("intents/election");
    ServeProcess::start(
        env!("CARGO_BIN_EXE_tidings"),
        &[
            "--data",
            data.to_str().unwrap(),
            "--intents",
            intents.to_str().unwrap(),
            // One reader asks the whole night's questions in a burst, all
            // from one address: a fast build outruns the per-source limit.
            "--reader-rate",
            "0",
            "--source-rate",
            "0",
        ],
        &[("TIDINGS_ADMIN_TOKEN", TOKEN)],
    )
}

fn text(reply: &Value) -> &str {
    reply["text"].as_str().unwrap_or_default()
}

/// Plays `files` through the real `tidings replay`; returns its output.
fn replay(base: &str, files: &[PathBuf], speed: &str) -> (i32, String, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_tidings"))
        .arg("replay")
        .args(["--server", base, "--speed", speed])
        .args(files)
        .env("TIDINGS_ADMIN_TOKEN", TOKEN)
        .output()
        .expect("tidings replay runs");
    (
        out.status.code().unwrap_or(-1),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
}

/// Asks the questions of the night and checks each answer against the
/// state the test computed for this moment.
async fn check_moment(
    client: &reqwest::Client,
    base: &str,
    truth: &Truth,
    version: u64,
    moment: &str,
) {
    let reader = format!("reader-{moment}");
    let ask = |q: &'static str| {
        let reader = reader.clone();
        async move { ask_at(client, base, &reader, q).await }
    };

    // Who is leading, by how many votes and points, with how much counted.
    for (ward_id, q) in [
        ("marrowby", "who is leading in Marrowby?"),
        ("ashvenny-south", "whos ahead in ashvenny south"),
        ("brindle-quay", "how close is it in Brindle Quay?"),
    ] {
        let r = ask(q).await;
        let w = truth.ward(ward_id);
        let t = text(&r);
        assert_eq!(r["intent"], "ward_leader", "{moment}: {q}: {r}");
        assert_eq!(r["dataset_version"], version, "{moment}: {q}");
        match w.status.as_str() {
            "scheduled" => {
                assert_eq!(r["outcome"], "no_data", "{moment}: {q}: {t}");
                assert!(t.contains("has not started"), "{moment}: {q}: {t}");
            }
            status => {
                let total: u64 = w.entries.iter().map(|e| e.2).sum();
                let (first, second) = (&w.entries[0], &w.entries[1]);
                let (name, party) = truth.person(&first.0);
                let (runner_up, _) = truth.person(&second.0);
                let gap = first.2 - second.2;
                let points_tenths = {
                    // Points from the unrounded shares, to one decimal.
                    let num = gap * 2000 + total;
                    num / (2 * total)
                };
                for want in [
                    format!("{name} ({party})"),
                    format!("{} votes", thousands(first.2)),
                    format!("({})", share(first.2, total)),
                    format!("ahead of {runner_up}"),
                    format!(
                        "by {} vote{}",
                        thousands(gap),
                        if gap == 1 { "" } else { "s" }
                    ),
                    format!("{}.{} points", points_tenths / 10, points_tenths % 10),
                    format!(
                        "{} of the expected vote counted",
                        counted(w.counted.unwrap())
                    ),
                ] {
                    assert!(t.contains(&want), "{moment}: {q}: wanted {want:?} in {t:?}");
                }
                if status == "final" {
                    assert!(t.contains("has been called"), "{moment}: {q}: {t}");
                    assert!(
                        t.contains(&format!("{name} ({party}) won")),
                        "{moment}: {q}: {t}"
                    );
                } else {
                    assert!(
                        t.contains(&format!("{name} ({party}) leads")),
                        "{moment}: {q}: {t}"
                    );
                    assert!(
                        !t.contains("won"),
                        "{moment}: {q}: a live race is not won: {t}"
                    );
                }
            }
        }
    }

    // While a ward counts, "is X ahead of Y" is answered by the count so
    // far; "did X win" is not answered until the ward declares.
    for w in truth.wards.values().filter(|w| w.status == "live") {
        let (ahead, _) = truth.person(&w.entries[0].0);
        let (behind, _) = truth.person(&w.entries[1].0);
        let fresh = format!("{reader}-so-far-{}", w.name);
        let q = format!("is {ahead} ahead of {behind}");
        let r = ask_at(client, base, &fresh, &q).await;
        assert_eq!(r["intent"], "candidates_compared", "{moment}: {q}: {r}");
        assert_eq!(r["outcome"], "answered", "{moment}: {q}: {r}");
        assert!(text(&r).contains("so far"), "{moment}: {q}: {r}");
        let q = format!("did {ahead} win");
        let r = ask_at(client, base, &fresh, &q).await;
        assert_eq!(r["outcome"], "no_data", "{moment}: {q}: {r}");
    }

    // Which races are still open, with how much is counted in each.
    let r = ask("which races are still open?").await;
    let t = text(&r);
    assert_eq!(r["intent"], "open_races", "{moment}: {r}");
    let live: Vec<&Ward> = truth
        .wards
        .values()
        .filter(|w| w.status == "live")
        .collect();
    let not_started = truth
        .wards
        .values()
        .filter(|w| w.status == "scheduled")
        .count() as u64;
    let decided = truth.wards.values().filter(|w| w.status == "final").count() as u64;
    for w in &live {
        let want = format!("{} ({} counted)", w.name, counted(w.counted.unwrap()));
        assert!(
            t.contains(&want),
            "{moment}: open races: wanted {want:?} in {t:?}"
        );
    }
    for w in truth.wards.values().filter(|w| w.status == "final") {
        assert!(
            !t.contains(&format!("{} (", w.name)),
            "{moment}: {} is called: {t}",
            w.name
        );
    }
    if not_started > 4 {
        let want = format!("Not started yet: {}", count(not_started, "race"));
        assert!(t.contains(&want), "{moment}: wanted {want:?} in {t:?}");
    } else if not_started > 0 {
        // A few are each named, so none is left out of "which are left".
        let rest = t
            .split_once("Not started yet: ")
            .map(|x| x.1)
            .unwrap_or_default();
        for w in truth.wards.values().filter(|w| w.status == "scheduled") {
            assert!(
                rest.contains(&w.name),
                "{moment}: {} not named as not started: {t}",
                w.name
            );
        }
    } else {
        assert!(!t.contains("Not started"), "{moment}: {t}");
    }
    if live.is_empty() && not_started == 0 {
        assert!(t.contains("Every race has been called"), "{moment}: {t}");
    }
    if decided > 0 {
        assert!(t.contains(&count(decided, "seat")), "{moment}: {t}");
    }

    // Seats so far, and one party's count with its rank.
    let seats = truth.seats();
    let r = ask("seats so far").await;
    let t = text(&r);
    assert_eq!(r["intent"], "seat_totals", "{moment}: {r}");
    if seats.is_empty() {
        assert_eq!(r["outcome"], "no_data", "{moment}: {t}");
        assert!(t.contains("No seat has been declared yet"), "{moment}: {t}");
    } else {
        for (party, n) in &seats {
            let want = format!("{party} ({})", count(*n, "seat"));
            assert!(
                t.contains(&want),
                "{moment}: seats: wanted {want:?} in {t:?}"
            );
        }
        let open = truth.wards.len() as u64 - decided;
        if open > 0 {
            assert!(
                t.contains(&format!("{} still to declare", count(open, "race"))),
                "{moment}: {t}"
            );
        }
    }
    let r = ask("how many seats have the Progressives won?").await;
    let t = text(&r);
    assert_eq!(r["intent"], "party_seats", "{moment}: {r}");
    match seats.get("Moorland Progressives") {
        None => assert!(t.contains("have not won a seat yet"), "{moment}: {t}"),
        Some(&n) => {
            assert!(
                t.contains(&format!(
                    "Moorland Progressives have won {}",
                    count(n, "seat")
                )),
                "{moment}: {t}"
            );
            // "so far" only while races are still open.
            let open = truth.wards.values().any(|w| w.status != "final");
            assert_eq!(t.contains("so far"), open, "{moment}: {t}");
        }
    }

    // The full result of a ward, every candidate with votes and share.
    let r = ask("results in Lanmouth").await;
    let t = text(&r);
    assert_eq!(r["intent"], "ward_results", "{moment}: {r}");
    let w = truth.ward("lanmouth");
    if w.status == "scheduled" {
        assert!(t.contains("has not started"), "{moment}: {t}");
    } else {
        let total: u64 = w.entries.iter().map(|e| e.2).sum();
        for (id, place, votes) in &w.entries {
            let (name, party) = truth.person(id);
            let want = format!(
                "{place}. {name} ({party}) {} votes ({})",
                thousands(*votes),
                share(*votes, total)
            );
            assert!(
                t.contains(&want),
                "{moment}: results: wanted {want:?} in {t:?}"
            );
        }
        let word = if w.status == "final" {
            "called"
        } else {
            "still counting"
        };
        assert!(t.contains(word), "{moment}: {t}");
    }

    // Has the leader of a ward won? Only once the race is called.
    let w = truth.ward("brindle-quay");
    if let Some((id, _, _)) = w.entries.first() {
        let (name, _) = truth.person(id);
        let q = format!("has {name} won?");
        let r = ask_at(client, base, &reader, &q).await;
        let t = text(&r);
        assert_eq!(r["intent"], "candidate_result", "{moment}: {q}: {r}");
        if w.status == "final" {
            assert!(t.contains("won the seat"), "{moment}: {q}: {t}");
        } else {
            assert!(t.starts_with("Not decided yet"), "{moment}: {q}: {t}");
            assert!(!t.contains("won the seat"), "{moment}: {q}: {t}");
        }
    }
}

/// The same questions on the SMS and voice channels: one SMS segment by
/// 3GPP TS 23.038, and a valid SSML 1.1 document whose spoken text has no
/// figure or symbol a speech engine would read oddly.
async fn check_channels(client: &reqwest::Client, base: &str, moment: &str) {
    const QUESTIONS: [&str; 9] = [
        "who is leading in Marrowby?",
        "how close is it in Brindle Quay?",
        "which races are still open?",
        "seats so far",
        "how many seats have the Greens won?",
        "results in Lanmouth",
        "how much is counted in Caddenmill?",
        "who won Fennick Green?",
        "who is leading in Ashvenny?",
    ];
    for q in QUESTIONS {
        for channel in ["sms", "voice"] {
            let r = ask_on(client, base, &format!("{channel}-{moment}"), q, channel).await;
            let t = text(&r);
            assert!(!t.is_empty(), "{moment}: {channel}: {q}: {r}");
            if channel == "sms" {
                let (units, limit) = (&r["sms"]["units"], &r["sms"]["limit"]);
                assert!(
                    units.as_u64().unwrap() <= limit.as_u64().unwrap(),
                    "{moment}: {q}: {units} of {limit}: {t}"
                );
            } else {
                let doc = r["ssml"].as_str().expect("voice replies carry SSML");
                if let Err(e) = common::speech::check_ssml(doc) {
                    panic!("{moment}: {q}: {e}\n{doc}");
                }
                let odd: Vec<char> = t
                    .chars()
                    .filter(|c| "()[]{}<>*#/\\|_~^@&%\"".contains(*c) || c.is_ascii_digit())
                    .collect();
                assert!(odd.is_empty(), "{moment}: {q}: {t:?} has {odd:?}");
            }
        }
    }
}

#[tokio::test(flavor = "multi_thread", worker_threads = 2)]
async fn the_election_night_replayed_answers_from_each_moment() {
    let server = election_server();
    let client = reqwest::Client::new();
    let files = batch_files();
    assert!(files.len() >= 15, "the night has {} batches", files.len());

    let mut truth = Truth::start();
    // Moments of the night: before the first count, early counting, the
    // middle of the night with races called and counts running, the end.
    let stops = [0, 5, 13, files.len()];
    let mut done = 0;
    for (k, &stop) in stops.iter().enumerate() {
        if stop > done {
            let (code, out, err) = replay(&server.base, &files[done..stop], "0");
            assert_eq!(code, 0, "replay failed: {out}\n{err}");
            assert_eq!(out.lines().count(), stop - done, "one line a batch: {out}");
            for f in &files[done..stop] {
                truth.apply(&read_json(f));
            }
            done = stop;
        }
        let moment = format!("moment {k} (after {done} batches)");
        check_moment(&client, &server.base, &truth, 1 + done as u64, &moment).await;
        check_channels(&client, &server.base, &moment).await;
    }

    // The night ends with every race called and every seat filled.
    assert!(truth.wards.values().all(|w| w.status == "final"));
    assert_eq!(
        truth.seats().values().sum::<u64>(),
        truth.wards.len() as u64
    );
    drop(server);
}

#[tokio::test(flavor = "multi_thread", worker_threads = 2)]
async fn the_replay_keeps_time_and_stops_at_a_refused_batch() {
    let server = election_server();
    let files = batch_files();
    // Two batches 15 minutes of night apart, at 1,800 times the pace: the
    // second waits half a second.
    let started = Instant::now();
    let (code, out, err) = replay(&server.base, &files[..2], "1800");
    let took = started.elapsed();
    assert_eq!(code, 0, "{out}\n{err}");
    assert!(took >= Duration::from_millis(450), "took {took:?}");

    // A batch the server refuses stops the replay; nothing after it is sent.
    let dir = std::env::temp_dir().join(format!("tidings-election-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let bad = dir.join("01-bad.json");
    std::fs::write(
        &bad,
        r#"{"as_of": "2027-05-06T23:14:00+01:00", "changes": [{"change": "results", "contest": "no-such-ward", "status": "live"}]}"#,
    )
    .unwrap();
    let (code, _, err) = replay(&server.base, &[bad.clone(), files[2].clone()], "0");
    assert_eq!(code, 1, "{err}");
    assert!(
        err.contains("refused") && err.contains("no-such-ward"),
        "{err}"
    );
    let client = reqwest::Client::new();
    let r = ask_at(&client, &server.base, "r1", "which races are still open?").await;
    assert_eq!(
        r["dataset_version"], 3,
        "only the two good batches landed: {r}"
    );

    // A file that is not JSON is found before anything is sent.
    let broken = dir.join("02-broken.json");
    std::fs::write(
        &broken,
        "{\n  \"changes\": [\n    {\"change\": \"results\",, }\n  ]\n}\n",
    )
    .unwrap();
    let (code, out, err) = replay(&server.base, &[files[2].clone(), broken.clone()], "0");
    assert_eq!(code, 1);
    assert!(out.is_empty(), "nothing sent: {out}");
    assert!(err.contains("02-broken.json:3:"), "{err}");
    let r = ask_at(&client, &server.base, "r2", "which races are still open?").await;
    assert_eq!(r["dataset_version"], 3, "{r}");

    // The wrong token is refused with the server's reason.
    let out = Command::new(env!("CARGO_BIN_EXE_tidings"))
        .args(["replay", "--server", &server.base, "--speed", "0"])
        .arg(&files[2])
        .env("TIDINGS_ADMIN_TOKEN", "not-the-token-at-all-000")
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(1));
    assert!(String::from_utf8_lossy(&out.stderr).contains("401"));
    std::fs::remove_dir_all(&dir).unwrap();
    drop(server);
}

/// Asks one question of the election scenario after the batches in `dir`
/// (the real `tidings ask --replay`); returns exit code and output.
fn ask_after(dir: &Path, until: Option<&str>, question: &str) -> (i32, String) {
    let data = root().join("dataset-demo/election");
    let intents = root().join("intents/election");
    let mut cmd = Command::new(env!("CARGO_BIN_EXE_tidings"));
    cmd.arg("ask")
        .args(["--data", data.to_str().unwrap()])
        .args(["--intents", intents.to_str().unwrap()])
        .args(["--replay", dir.to_str().unwrap()]);
    if let Some(t) = until {
        cmd.args(["--until", t]);
    }
    let out = cmd.arg(question).output().unwrap();
    (
        out.status.code().unwrap_or(-1),
        String::from_utf8_lossy(&out.stdout).into_owned() + &String::from_utf8_lossy(&out.stderr),
    )
}

/// Writes batch files into a fresh folder of the test's own.
fn batches(name: &str, files: &[(&str, &str)]) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("tidings-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    for (file, body) in files {
        std::fs::write(dir.join(file), body).unwrap();
    }
    dir
}

/// Counts that have begun without figures, all-zero counts and a shared
/// first place: never a made-up leader, a "leads with 0 votes" or a lone
/// "1st" for a shared place.
#[test]
fn a_count_without_figures_and_a_shared_lead_are_said_as_they_are() {
    // Marrowby (Rosmund Vossery c30, Vesna Whitmarren c31, Talia Yarrowby
    // c32) opened, nothing in yet.
    let opened = batches(
        "opened",
        &[(
            "01.json",
            r#"{"as_of": "2027-05-06T23:31:00+01:00", "changes": [{"change": "results", "contest": "marrowby", "status": "live", "counted": 0.0,
                "entries": [{"competitor": "c30"}, {"competitor": "c31"}, {"competitor": "c32"}]}]}"#,
        )],
    );
    let (code, out) = ask_after(&opened, None, "did Rosmund Vossery win?");
    assert_eq!(code, 0, "{out}");
    assert!(
        out.starts_with("Not decided yet: counting is still under way in Marrowby"),
        "{out}"
    );
    assert!(!out.contains(" is with") && !out.contains("1st"), "{out}");
    let (_, out) = ask_after(&opened, None, "who is leading in Marrowby?");
    assert!(out.contains("no figures for Marrowby yet"), "{out}");
    // Every candidate on zero: no leader either.
    let zero = batches(
        "zero",
        &[(
            "01.json",
            r#"{"as_of": "2027-05-06T23:31:00+01:00", "changes": [{"change": "results", "contest": "marrowby", "status": "live", "counted": 0.01,
                "entries": [{"competitor": "c30", "place": 1, "mark": "0"}, {"competitor": "c31", "place": 1, "mark": "0"}, {"competitor": "c32", "place": 1, "mark": "0"}]}]}"#,
        )],
    );
    let (_, out) = ask_after(&zero, None, "who is leading in Marrowby?");
    assert!(out.contains("no figures for Marrowby yet"), "{out}");
    assert!(!out.contains("0 votes"), "{out}");
    let (_, out) = ask_after(&zero, None, "results in Marrowby");
    assert!(out.contains("no figures for Marrowby yet"), "{out}");
    // Two level at the top: level, and each "joint 1st".
    let level = batches(
        "level",
        &[(
            "01.json",
            r#"{"as_of": "2027-05-06T23:40:00+01:00", "changes": [{"change": "results", "contest": "marrowby", "status": "live", "counted": 0.1,
                "entries": [{"competitor": "c30", "place": 1, "mark": "200"}, {"competitor": "c31", "place": 1, "mark": "200"}, {"competitor": "c32", "place": 3, "mark": "90"}]}]}"#,
        )],
    );
    let (_, out) = ask_after(&level, None, "who is leading in Marrowby?");
    assert!(
        out.contains("are level in Marrowby on 200 votes each"),
        "{out}"
    );
    let (_, out) = ask_after(&level, None, "how is Vesna Whitmarren doing?");
    // 200 of 490 votes: 40.8%.
    assert!(out.contains("joint 1st with 200 votes (40.8%)"), "{out}");
}

/// `--until` answers as at that moment, and batches out of time order are
/// refused before anything is applied.
#[test]
fn until_sets_the_moment_and_the_night_only_moves_forward() {
    let dir = root().join("dataset-demo/election/replay");
    // At 00:10 the last update was the 00:00 batch, 10 minutes before.
    let (code, out) = ask_after(
        &dir,
        Some("2027-05-07T00:10:00+01:00"),
        "who is leading in Ashvenny South?",
    );
    assert_eq!(code, 0, "{out}");
    assert!(out.contains("as of 00:00"), "{out}");
    // Past --stale-after (10 minutes by default) the answer says how old.
    let (_, out) = ask_after(
        &dir,
        Some("2027-05-07T00:14:00+01:00"),
        "who is leading in Ashvenny South?",
    );
    assert!(out.contains("as of 00:00, 14 minutes ago"), "{out}");
    let backwards = batches(
        "backwards",
        &[
            (
                "01.json",
                r#"{"as_of": "2027-05-06T23:40:00+01:00", "changes": [{"change": "schedule", "contest": "marrowby", "venue": "Marrowby Hall"}]}"#,
            ),
            (
                "02.json",
                r#"{"as_of": "2027-05-06T23:20:00+01:00", "changes": [{"change": "schedule", "contest": "marrowby", "venue": "Tamsendale Civic Hall"}]}"#,
            ),
        ],
    );
    let (code, out) = ask_after(&backwards, None, "where is Marrowby counted?");
    assert_ne!(code, 0, "{out}");
    assert!(
        out.contains("02.json") && out.contains("earlier than"),
        "{out}"
    );
}

/// A full question naming only the word that tells two wards apart, right
/// after the other one, is about the ward named, never the last one again.
#[test]
fn the_other_ward_by_its_one_different_word() {
    let out = Command::new(env!("CARGO_BIN_EXE_tidings"))
        .arg("chat")
        .args(["--data", root().join("dataset-demo/election").to_str().unwrap()])
        .args(["--intents", root().join("intents/election").to_str().unwrap()])
        .args(["--replay", root().join("dataset-demo/election/replay").to_str().unwrap()])
        .args(["--until", "2027-05-07T01:45:00+01:00"])
        .stdin(std::process::Stdio::piped())
        .stdout(std::process::Stdio::piped())
        .spawn()
        .and_then(|mut child| {
            use std::io::Write;
            child.stdin.take().unwrap().write_all(
                b"who is leading in Ashvenny South?\nand who is leading in the north?\nhow much is counted in the south?\n",
            )?;
            child.wait_with_output()
        })
        .unwrap();
    let text = String::from_utf8_lossy(&out.stdout);
    let replies: Vec<&str> = text
        .lines()
        .filter(|l| l.starts_with("> ") && l.len() > 2)
        .collect();
    assert_eq!(replies.len(), 3, "{text}");
    assert!(replies[0].contains("in Ashvenny South"), "{text}");
    assert!(
        replies[1].contains("Ashvenny North has been called"),
        "{text}"
    );
    assert!(
        replies[2].contains("Counting is under way in Ashvenny South"),
        "{text}"
    );
}

/// A seat tied on votes and decided by lot: the data place the two apart
/// with equal votes, the seat goes to one, and answers name one winner,
/// one seat and no made-up margin.
#[test]
fn a_tie_decided_by_lot_has_one_winner() {
    let lot = batches(
        "lot",
        &[(
            "01.json",
            r#"{"as_of": "2027-05-07T02:40:00+01:00", "changes": [{"change": "results", "contest": "marrowby", "status": "final", "counted": 1.0,
                "entries": [{"competitor": "c31", "place": 1, "mark": "1,500", "award": "seat"}, {"competitor": "c30", "place": 2, "mark": "1,500"}, {"competitor": "c32", "place": 3, "mark": "700"}]}]}"#,
        )],
    );
    let (code, out) = ask_after(&lot, None, "who won Marrowby?");
    assert_eq!(code, 0, "{out}");
    assert!(
        out.starts_with(
            "Vesna Whitmarren (Harbour Alliance) won Marrowby with 1,500 votes (40.5%)"
        ),
        "{out}"
    );
    assert!(!out.contains("Rosmund Vossery"), "{out}");
    let (_, out) = ask_after(&lot, None, "who is leading in Marrowby?");
    assert!(
        out.contains("Vesna Whitmarren (Harbour Alliance) won"),
        "{out}"
    );
    assert!(
        !out.contains("by 0") && !out.contains("0.0 points"),
        "{out}"
    );
    let (_, out) = ask_after(&lot, None, "seats so far");
    assert!(
        out.contains("Harbour Alliance (one seat)") && !out.contains("Moorland"),
        "{out}"
    );
}
