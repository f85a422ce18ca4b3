//! Contests between two sides, home and away, measured by a score (a
//! match): the rules their records follow, the places the score gives, the
//! name readers know them by ("Harrowby Town v Lanner Vale") and the
//! score line operations read.
//!
//! A draw is a result: both sides share first place (standard competition
//! ranking) and no award is due for it.

use super::model::*;
use super::Dataset;

/// A problem found in one contest: the record, the field and the message,
/// for the loader to report with the file.
pub type Problem = (String, &'static str, String);

/// Whether the contest is measured by a two-sided score.
pub fn two_sided(c: &Contest) -> bool {
    c.measure == Measure::Score
}

/// Fills in places from the score when no entry of a two-sided contest
/// has one: the higher score first, a draw shared first. A contest that
/// gives places itself (a draw decided on penalties: places 1 and 2 with
/// equal scores) is checked, not changed. Abandoned and not-started
/// contests get no places.
pub fn fill_places(contests: &mut [Contest]) {
    for c in contests.iter_mut().filter(|c| two_sided(c)) {
        let played = matches!(c.status, Status::Live | Status::Final | Status::Suspended);
        if !played || c.entries.len() != 2 || c.entries.iter().any(|e| e.place.is_some()) {
            continue;
        }
        if c.entries.iter().any(|e| e.status != EntryStatus::Ok) {
            continue;
        }
        let scores: Vec<Option<u64>> = c.entries.iter().map(|e| score_of(c, e)).collect();
        let (Some(a), Some(b)) = (scores[0], scores[1]) else {
            continue;
        };
        let lower_wins = c.better == Some(Better::Lower);
        let (pa, pb) = match a.cmp(&b) {
            std::cmp::Ordering::Equal => (1, 1),
            std::cmp::Ordering::Greater if !lower_wins => (1, 2),
            std::cmp::Ordering::Less if lower_wins => (1, 2),
            _ => (2, 1),
        };
        c.entries[0].place = Some(pa);
        c.entries[1].place = Some(pb);
    }
}

fn score_of(c: &Contest, e: &Entry) -> Option<u64> {
    e.mark
        .as_deref()
        .and_then(|m| super::mark::parse(c.measure, m).ok())
        .map(|m| m.units())
}

/// Checks the rules that only two-sided contests have: exactly two
/// entries, one home and one away; a score for each side once the contest
/// is final; and sides only where the contest is measured by a score.
pub fn check(c: &Contest) -> Vec<Problem> {
    let mut out = Vec::new();
    if !two_sided(c) {
        for (i, e) in c.entries.iter().enumerate() {
            if e.side.is_some() {
                out.push((
                    format!("{} entry {}", c.id, i + 1),
                    "side",
                    "a side (home or away) is only for contests measured by a score".to_string(),
                ));
            }
        }
        return out;
    }
    if c.entries.len() != 2 {
        out.push((
            c.id.clone(),
            "entries",
            format!(
                "a contest measured by a score has two entries, home and away; this one has {}",
                c.entries.len()
            ),
        ));
    }
    let mut seen = Vec::new();
    for (i, e) in c.entries.iter().enumerate() {
        let rec = format!("{} entry {}", c.id, i + 1);
        match e.side {
            None => out.push((
                rec.clone(),
                "side",
                "an entry of a contest measured by a score needs side \"home\" or \"away\""
                    .to_string(),
            )),
            Some(s) if seen.contains(&s) => out.push((
                rec.clone(),
                "side",
                format!("two entries are on the {} side", side_name(s)),
            )),
            Some(s) => seen.push(s),
        }
        if c.status == Status::Final && e.status == EntryStatus::Ok && e.mark.is_none() {
            out.push((
                rec,
                "mark",
                "a final contest measured by a score needs each side's score".to_string(),
            ));
        }
    }
    out
}

/// "home" or "away".
pub fn side_name(s: Side) -> &'static str {
    match s {
        Side::Home => "home",
        Side::Away => "away",
    }
}

/// Whether a two-sided contest ended level with both sides placed first:
/// a draw is a result, and no award is due for it.
pub fn is_draw(c: &Contest) -> bool {
    two_sided(c) && c.entries.len() == 2 && c.entries.iter().all(|e| e.place == Some(1))
}

/// The name of a two-sided contest: "Harrowby Town v Lanner Vale", home
/// side first. When the same two sides meet the same way round more than
/// once (a league match and a cup tie), the competition and round follow
/// in brackets: "Harrowby Town v Lanner Vale (cup, semi-final)".
pub fn contest_name(
    contests: &[Contest],
    sports: &[Sport],
    groups: &[Group],
    competitors: &[Competitor],
    ci: usize,
) -> Option<String> {
    let c = &contests[ci];
    let pair = |c: &Contest| -> Option<(String, String)> {
        if !two_sided(c) {
            return None;
        }
        let name = |s: Side| {
            let e = c.entries.iter().find(|e| e.side == Some(s))?;
            if let Some(g) = &e.group {
                return groups.iter().find(|x| &x.id == g).map(|x| x.name.clone());
            }
            let p = e.competitor.as_ref()?;
            competitors.iter().find(|x| &x.id == p).map(|x| x.name())
        };
        Some((name(Side::Home)?, name(Side::Away)?))
    };
    let (home, away) = pair(c)?;
    let mut out = format!("{home} v {away}");
    let repeated = contests
        .iter()
        .enumerate()
        .any(|(j, o)| j != ci && pair(o).is_some_and(|p| p == (home.clone(), away.clone())));
    if repeated {
        let discipline = sports
            .iter()
            .find(|s| s.id == c.sport)
            .and_then(|s| s.disciplines.iter().find(|d| d.id == c.discipline))
            .map(|d| d.name.as_str())
            .unwrap_or(&c.discipline);
        out.push_str(&format!(" ({discipline}"));
        if let Some(r) = &c.round {
            out.push_str(&format!(", {r}"));
        }
        out.push(')');
    }
    Some(out)
}

/// How a side's contest ended for it.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Outcome {
    Won,
    Drawn,
    Lost,
}

impl Outcome {
    /// The one-letter form of a run of results ("W D L W W").
    pub fn letter(self) -> char {
        match self {
            Outcome::Won => 'W',
            Outcome::Drawn => 'D',
            Outcome::Lost => 'L',
        }
    }
}

/// The two sides of a contest with their scores, as the data stand.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct ScoreLine {
    /// Entry indexes of the home and away sides.
    pub home: usize,
    pub away: usize,
    /// Each side's score, when there is one.
    pub home_score: Option<u64>,
    pub away_score: Option<u64>,
}

impl ScoreLine {
    /// Both scores, when both are known.
    pub fn scores(&self) -> Option<(u64, u64)> {
        Some((self.home_score?, self.away_score?))
    }

    /// "3–2", home first, with an en dash (a score never reads as a
    /// subtraction or a range of points).
    pub fn text(&self) -> Option<String> {
        let (h, a) = self.scores()?;
        Some(format!("{h}\u{2013}{a}"))
    }

    /// The entry index of the other side.
    pub fn other(&self, entry: usize) -> usize {
        if entry == self.home {
            self.away
        } else {
            self.home
        }
    }
}

impl Dataset {
    /// The score line of a two-sided contest; `None` for any other.
    pub fn score_line(&self, contest: usize) -> Option<ScoreLine> {
        let c = &self.contests[contest];
        if !two_sided(c) {
            return None;
        }
        let home = c.entries.iter().position(|e| e.side == Some(Side::Home))?;
        let away = c.entries.iter().position(|e| e.side == Some(Side::Away))?;
        let score = |i: usize| self.facts[contest].marks[i].map(|m| m.units());
        Some(ScoreLine {
            home,
            away,
            home_score: score(home),
            away_score: score(away),
        })
    }

    /// The entry index of a group in a contest, if it takes part.
    pub fn entry_of_group(&self, contest: usize, group: usize) -> Option<usize> {
        self.contests[contest]
            .entries
            .iter()
            .position(|e| self.entry_group(e) == Some(group))
    }

    /// How a two-sided contest went for one of its entries, by the score
    /// (a draw decided on penalties is a draw here; the side placed first
    /// goes through): `None` unless the contest is final with both scores.
    pub fn outcome_for(&self, contest: usize, entry: usize) -> Option<Outcome> {
        let c = &self.contests[contest];
        if c.status != Status::Final || c.entries[entry].status != EntryStatus::Ok {
            return None;
        }
        let line = self.score_line(contest)?;
        let (h, a) = line.scores()?;
        let (mine, theirs) = if entry == line.home { (h, a) } else { (a, h) };
        let lower_wins = self.facts[contest].better == Better::Lower;
        Some(match (mine.cmp(&theirs), lower_wins) {
            (std::cmp::Ordering::Equal, _) => Outcome::Drawn,
            (std::cmp::Ordering::Greater, false) | (std::cmp::Ordering::Less, true) => Outcome::Won,
            _ => Outcome::Lost,
        })
    }

    /// The names readers give a two-sided contest: each side by its name
    /// or an alias, home side first, joined by "v", "vs" or "versus"
    /// ("Ambervale v Kestrel Bay"). Empty for any other contest. "against"
    /// and "and" are left out: "Ambervale against Kestrel Bay" asks about
    /// the two clubs, not one match.
    pub fn match_names(&self, contest: usize) -> Vec<String> {
        let Some(line) = self.score_line(contest) else {
            return Vec::new();
        };
        let c = &self.contests[contest];
        let forms = |entry: usize| -> Vec<String> {
            match self.entry_group(&c.entries[entry]) {
                Some(g) => {
                    let g = &self.groups[g];
                    std::iter::once(g.name.clone())
                        .chain(g.aliases.iter().cloned())
                        .collect()
                }
                None => vec![self.entry_name(&c.entries[entry])],
            }
        };
        let (home, away) = (forms(line.home), forms(line.away));
        let mut out = Vec::new();
        for h in &home {
            for a in &away {
                for sep in ["v", "vs", "versus"] {
                    out.push(format!("{h} {sep} {a}"));
                }
            }
        }
        out
    }

    /// The unit of a score, singular or plural by `n`: "goal", "goals".
    pub fn score_unit(&self, n: u64) -> String {
        let one = &self.scenario.score_unit;
        if n == 1 {
            one.clone()
        } else {
            crate::answers::words::plural(one)
        }
    }
}

/// Small two-sided scenarios for unit tests across the crate.
#[cfg(test)]
pub(crate) mod testing {
    use crate::dataset::{load_files, Dataset, LoadError};

    /// One test match: id, home, away, status and the score.
    pub type Match<'a> = (&'a str, &'a str, &'a str, &'a str, Option<(u32, u32)>);

    /// A scenario of clubs `teams` (ids; names are the ids capitalised)
    /// and matches `(id, home, away, status, scores)`, with optional extra
    /// scenario fields (JSON members, without braces).
    pub fn league(
        teams: &[&str],
        matches: &[Match],
        scenario_extra: &str,
    ) -> Result<Dataset, LoadError> {
        let groups: Vec<String> = teams
            .iter()
            .map(|t| {
                let mut name = t.to_string();
                name[..1].make_ascii_uppercase();
                format!(r#"{{"id":"{t}","name":"{name} FC"}}"#)
            })
            .collect();
        let contests: Vec<String> = matches
            .iter()
            .enumerate()
            .map(|(i, (id, h, a, status, score))| {
                let mark = |s: Option<u32>| s.map(|s| format!(r#","mark":"{s}""#)).unwrap_or_default();
                format!(
                    r#"{{"id":"{id}","sport":"football","discipline":"league","phase":"match","round":"matchday {}","start":"2027-03-{:02}T15:00","status":"{status}","measure":"score","entries":[{{"group":"{h}","side":"home"{}}},{{"group":"{a}","side":"away"{}}}]}}"#,
                    i + 1,
                    i % 28 + 1,
                    mark(score.map(|s| s.0)),
                    mark(score.map(|s| s.1)),
                )
            })
            .collect();
        let sep = if scenario_extra.is_empty() { "" } else { "," };
        let files = [
            (
                "scenario.json",
                format!(
                    r#"{{"id":"t","title":"Test League","time_zone":"Europe/Lisbon","as_of":"2027-04-01T12:00:00+01:00","clock":"2027-04-01T12:00:00+01:00","score_unit":"goal"{sep}{scenario_extra}}}"#
                ),
            ),
            (
                "sports.json",
                r#"[{"id":"football","name":"football","noun":"player","disciplines":[{"id":"league","name":"league"},{"id":"cup","name":"cup"}]}]"#.to_string(),
            ),
            ("groups.json", format!("[{}]", groups.join(","))),
            ("competitors.json", "[]".to_string()),
            ("contests.json", format!("[{}]", contests.join(","))),
        ];
        load_files(&|name: &str| {
            let text = files
                .iter()
                .find(|(n, _)| *n == name)
                .map(|(_, t)| t.clone())
                .expect("a test file");
            Ok((name.to_string(), text))
        })
    }
}

#[cfg(test)]
mod tests {
    use super::testing::league;
    use super::*;
    use crate::dataset::LoadError;

    fn problems(r: Result<Dataset, LoadError>) -> Vec<String> {
        match r {
            Err(LoadError::Invalid(p)) => p.iter().map(|p| p.to_string()).collect(),
            Err(e) => vec![e.to_string()],
            Ok(_) => vec![],
        }
    }

    #[test]
    fn the_score_gives_the_places_and_a_draw_shares_first() {
        let d = league(
            &["ash", "birch"],
            &[
                ("m1", "ash", "birch", "final", Some((2, 1))),
                ("m2", "birch", "ash", "final", Some((1, 1))),
                ("m3", "ash", "birch", "live", Some((0, 3))),
            ],
            "",
        )
        .unwrap();
        let places = |c: usize| -> Vec<Option<u32>> {
            d.contests[c].entries.iter().map(|e| e.place).collect()
        };
        assert_eq!(places(0), vec![Some(1), Some(2)]);
        assert_eq!(places(1), vec![Some(1), Some(1)]);
        assert_eq!(places(2), vec![Some(2), Some(1)]);
        assert!(is_draw(&d.contests[1]));
        assert!(!is_draw(&d.contests[0]));
        assert_eq!(d.outcome_for(1, 0), Some(Outcome::Drawn));
        assert_eq!(d.outcome_for(0, 1), Some(Outcome::Lost));
        // A live match has no outcome yet.
        assert_eq!(d.outcome_for(2, 1), None);
        assert_eq!(d.score_line(0).unwrap().text().unwrap(), "2\u{2013}1");
    }

    #[test]
    fn a_match_is_named_home_side_first() {
        let d = league(
            &["ash", "birch"],
            &[("m1", "ash", "birch", "scheduled", None)],
            "",
        )
        .unwrap();
        assert_eq!(d.contest_name(0), "Ash FC v Birch FC");
        assert_eq!(d.score_unit(1), "goal");
        assert_eq!(d.score_unit(3), "goals");
    }

    #[test]
    fn the_same_pairing_twice_names_its_round() {
        let d = league(
            &["ash", "birch"],
            &[
                ("m1", "ash", "birch", "final", Some((1, 0))),
                ("m2", "ash", "birch", "scheduled", None),
            ],
            "",
        )
        .unwrap();
        assert_eq!(d.contest_name(0), "Ash FC v Birch FC (league, matchday 1)");
    }

    #[test]
    fn a_draw_in_a_final_needs_no_award() {
        // The scenario gives awards, and the match is a final: a draw is
        // still a result, with no first prize demanded.
        let d = league(
            &["ash", "birch"],
            &[("m1", "ash", "birch", "final", Some((1, 1)))],
            r#""awards":["winner"]"#,
        );
        // The test scenario's phase is "match"; a phase "final" is checked
        // by the same rule through `is_draw`.
        assert!(d.is_ok(), "{:?}", problems(d));
        let mut c: Contest = serde_json::from_str(
            r#"{"id":"f","sport":"football","discipline":"cup","phase":"final","start":"2027-05-01T15:00","status":"final","measure":"score","entries":[{"group":"ash","side":"home","mark":"2","place":1},{"group":"birch","side":"away","mark":"2","place":1}]}"#,
        )
        .unwrap();
        assert!(is_draw(&c));
        c.entries[1].place = Some(2);
        assert!(!is_draw(&c));
    }

    #[test]
    fn the_loader_demands_no_award_for_a_drawn_final_and_refuses_one() {
        let d = league(&["ash", "birch"], &[], r#""awards":["winner"]"#).unwrap();
        let mut records = crate::dataset::changes::Records::of(&d);
        let final_of = |award: &str| -> Contest {
            serde_json::from_str(&format!(
                r#"{{"id":"f","sport":"football","discipline":"cup","phase":"final","start":"2027-05-01T15:00","status":"final","measure":"score","entries":[{{"group":"ash","side":"home","mark":"2"{award}}},{{"group":"birch","side":"away","mark":"2"}}]}}"#
            ))
            .unwrap()
        };
        records.contests = vec![final_of("")];
        assert!(records.clone().build(2).is_ok());
        records.contests = vec![final_of(r#","award":"winner""#)];
        let p = problems(records.clone().build(2));
        assert!(p.iter().any(|m| m.contains("award")), "{p:?}");
        // Decided another way (places 1 and 2 with a level score), the
        // side placed first carries the first award.
        let mut decided = final_of(r#","award":"winner","place":1"#);
        decided.entries[1].place = Some(2);
        records.contests = vec![decided];
        assert!(records.build(2).is_ok());
    }

    #[test]
    fn sides_and_scores_are_checked() {
        let p = problems(league(
            &["ash", "birch"],
            &[("m1", "ash", "birch", "final", None)],
            "",
        ));
        assert_eq!(p.len(), 2, "{p:?}");
        assert!(p[0].contains("needs each side's score"), "{p:?}");
        let d = league(&["ash", "birch"], &[], "").unwrap();
        let mut c: Contest = serde_json::from_str(
            r#"{"id":"x","sport":"football","discipline":"league","phase":"match","start":"2027-05-01T15:00","status":"scheduled","measure":"score","entries":[{"group":"ash","side":"home"},{"group":"birch","side":"home"},{"group":"ash"}]}"#,
        )
        .unwrap();
        let found: Vec<String> = check(&c)
            .into_iter()
            .map(|(_, f, m)| format!("{f}: {m}"))
            .collect();
        assert!(found.iter().any(|m| m.contains("has 3")), "{found:?}");
        assert!(
            found
                .iter()
                .any(|m| m.contains("two entries are on the home side")),
            "{found:?}"
        );
        assert!(found.iter().any(|m| m.contains("needs side")), "{found:?}");
        c.measure = Measure::Points;
        let found = check(&c);
        assert_eq!(found.len(), 2, "{found:?}");
        assert!(found[0].2.contains("only for contests measured by a score"));
        drop(d);
    }

    #[test]
    fn a_score_is_a_whole_number() {
        let p = problems(league(
            &["ash", "birch"],
            &[("m1", "ash", "birch", "scheduled", None)],
            "",
        ));
        assert!(p.is_empty());
        assert!(crate::dataset::mark::parse(Measure::Score, "2.5").is_err());
        assert!(crate::dataset::mark::parse(Measure::Score, "1,000").is_err());
        let m = crate::dataset::mark::parse(Measure::Score, "3").unwrap();
        assert_eq!(crate::dataset::mark::format_text(Measure::Score, &m), "3");
        assert_eq!(
            crate::dataset::mark::format_spoken(Measure::Score, &m),
            "three"
        );
    }
}
