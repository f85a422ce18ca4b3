//! Tables computed from results with rules the scenario declares: a
//! league table (points per win, draw and loss; played, won, drawn, lost,
//! scored, conceded, difference), a medal table (awards counted, gold
//! before silver before bronze) or seat totals (seats counted), ordered by
//! tie-breakers in the declared order.
//!
//! Tables are never typed in: the engine computes every declared table
//! once per dataset version, when the data load and after each applied
//! batch (`load::build`). Rows level on every tie-breaker share a place by
//! standard competition ranking (1, 2, 2, 4).

use std::collections::{HashMap, HashSet};

use serde::{Deserialize, Serialize};

use super::model::*;
use super::sides::{self, Outcome};
use super::Dataset;

/// One table's rules, as `scenario.json` declares it under `tables`.
#[derive(Debug, Clone, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(deny_unknown_fields)]
pub struct TableRule {
    /// Short id, unique among the scenario's tables.
    pub id: Id,
    /// The table's name in replies ("Vellmark League table").
    pub name: String,
    /// What each row counts: `results` (played, won, drawn, lost, scored,
    /// conceded, points) or `awards` (each award of the scenario).
    pub count: TableCount,
    /// Only contests of this sport count.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub sport: Option<Id>,
    /// Only contests of this discipline (of `sport`) count.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub discipline: Option<Id>,
    /// Points per win, draw and loss, for `results` tables.
    #[serde(default)]
    pub points: PointsRule,
    /// The keys rows are ordered by, first to last (`dataset::table::Key`).
    pub order: Vec<String>,
}

/// What a table's rows count.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(rename_all = "snake_case")]
pub enum TableCount {
    /// Results of final contests: every group entered in a counted
    /// contest has a row, played or not.
    Results,
    /// Awards given in final contests: groups with at least one award.
    Awards,
}

/// Points for a win, a draw and a loss; 3, 1 and 0 unless declared.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(deny_unknown_fields)]
pub struct PointsRule {
    #[serde(default = "three")]
    pub win: i64,
    #[serde(default = "one")]
    pub draw: i64,
    #[serde(default)]
    pub loss: i64,
}

fn three() -> i64 {
    3
}
fn one() -> i64 {
    1
}

impl Default for PointsRule {
    fn default() -> Self {
        PointsRule {
            win: 3,
            draw: 1,
            loss: 0,
        }
    }
}

/// One ordering key of a table.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Key {
    /// More points first.
    Points,
    /// More wins first.
    Won,
    /// More draws first.
    Drawn,
    /// Fewer losses first.
    Lost,
    /// More scored first.
    Scored,
    /// Fewer conceded first.
    Conceded,
    /// Greater difference (scored minus conceded) first.
    Difference,
    /// More scored away from home first.
    AwayScored,
    /// Among the rows still level: points, then difference, then scored
    /// in the contests between those sides only.
    HeadToHead,
    /// More of one award first (the scenario's award at this index).
    Award(usize),
    /// More awards of any kind first.
    Total,
    /// Alphabetical by name: level rows then take a place each.
    Name,
}

/// Keys that count results, in the form editors write them.
const RESULT_KEYS: [(&str, Key); 9] = [
    ("points", Key::Points),
    ("won", Key::Won),
    ("drawn", Key::Drawn),
    ("lost", Key::Lost),
    ("scored", Key::Scored),
    ("conceded", Key::Conceded),
    ("difference", Key::Difference),
    ("away_scored", Key::AwayScored),
    ("head_to_head", Key::HeadToHead),
];

/// Reads one ordering key; `Err` says what is allowed.
pub fn parse_key(name: &str, count: TableCount, awards: &[String]) -> Result<Key, String> {
    if name == "name" {
        return Ok(Key::Name);
    }
    let result = RESULT_KEYS
        .iter()
        .find(|(n, _)| *n == name)
        .map(|(_, k)| *k);
    let award = awards.iter().position(|a| a == name).map(Key::Award);
    let total = (name == "total").then_some(Key::Total);
    match (count, result, award.or(total)) {
        (TableCount::Results, Some(k), _) | (TableCount::Awards, _, Some(k)) => Ok(k),
        (TableCount::Results, None, Some(_)) => Err(format!(
            "key {name:?} counts awards; this table counts results"
        )),
        (TableCount::Awards, Some(_), None) => Err(format!(
            "key {name:?} counts results; this table counts awards"
        )),
        _ => {
            let allowed: Vec<String> = match count {
                TableCount::Results => RESULT_KEYS.iter().map(|(n, _)| n.to_string()).collect(),
                TableCount::Awards => awards
                    .iter()
                    .cloned()
                    .chain(["total".to_string()])
                    .collect(),
            };
            Err(format!(
                "unknown key {name:?}; keys are {} and name",
                allowed.join(", ")
            ))
        }
    }
}

/// A problem in the table rules: the record (the table's id), the field
/// and the message, for the loader to report against `scenario.json`.
pub type Problem = (String, String, String);

/// Checks every table's rules against the scenario.
pub fn check_rules(scenario: &Scenario, sports: &[Sport]) -> Vec<Problem> {
    let mut out = Vec::new();
    let mut ids = HashSet::new();
    for (i, t) in scenario.tables.iter().enumerate() {
        let rec = if t.id.trim().is_empty() {
            out.push((
                format!("tables #{}", i + 1),
                "id".into(),
                "id is empty".into(),
            ));
            format!("tables #{}", i + 1)
        } else {
            t.id.clone()
        };
        let mut add = |field: &str, msg: String| out.push((rec.clone(), field.to_string(), msg));
        if !t.id.trim().is_empty() && !ids.insert(t.id.as_str()) {
            add("id", "duplicate table id".into());
        }
        if t.name.trim().is_empty() {
            add("name", "a table needs a name".into());
        }
        let sport = t.sport.as_ref().map(|s| sports.iter().find(|x| &x.id == s));
        match (&sport, &t.discipline) {
            (Some(None), _) => add(
                "sport",
                format!(
                    "no sport with id {:?}",
                    t.sport.as_deref().unwrap_or_default()
                ),
            ),
            (None, Some(_)) => add("discipline", "a discipline needs its sport".into()),
            (Some(Some(s)), Some(d)) if !s.disciplines.iter().any(|x| &x.id == d) => add(
                "discipline",
                format!("sport {:?} has no discipline {d:?}", s.id),
            ),
            _ => {}
        }
        if t.order.is_empty() {
            add("order", "a table needs at least one key to order by".into());
        }
        let mut seen = HashSet::new();
        for k in &t.order {
            if let Err(e) = parse_key(k, t.count, &scenario.awards) {
                add("order", e);
            } else if !seen.insert(k.as_str()) {
                add("order", format!("key {k:?} listed twice"));
            }
        }
    }
    out
}

/// One row of a computed table.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct TableRow {
    /// The group's index in the dataset.
    pub group: usize,
    /// Place by standard competition ranking (1, 2, 2, 4).
    pub rank: u32,
    pub played: u32,
    pub won: u32,
    pub drawn: u32,
    pub lost: u32,
    pub scored: u64,
    pub conceded: u64,
    pub away_scored: u64,
    pub points: i64,
    /// Awards counted, in the scenario's award order.
    pub awards: Vec<u32>,
}

impl TableRow {
    /// Scored minus conceded.
    pub fn difference(&self) -> i64 {
        self.scored as i64 - self.conceded as i64
    }
    /// Awards of every kind.
    pub fn total(&self) -> u32 {
        self.awards.iter().sum()
    }
}

/// A table as computed for one dataset version.
#[derive(Debug, Clone)]
pub struct Table {
    /// Index of its rule in the scenario's `tables`.
    pub rule: usize,
    /// Rows in order, best first.
    pub rows: Vec<TableRow>,
    /// Contests that count towards it and are not final yet (scheduled,
    /// live, postponed, suspended).
    pub still_to_play: usize,
}

impl Table {
    /// The row of a group, if it has one.
    pub fn row_of(&self, group: usize) -> Option<&TableRow> {
        self.rows.iter().find(|r| r.group == group)
    }
}

/// Whether a contest counts towards a table.
pub fn counts_towards(rule: &TableRule, c: &Contest) -> bool {
    rule.sport.as_ref().is_none_or(|s| *s == c.sport)
        && rule.discipline.as_ref().is_none_or(|d| *d == c.discipline)
}

/// Computes every declared table.
pub fn compute_all(data: &Dataset) -> Vec<Table> {
    (0..data.scenario.tables.len())
        .map(|i| compute(data, i))
        .collect()
}

/// Computes the table of rule `rule` from the final contests.
pub fn compute(data: &Dataset, rule: usize) -> Table {
    let (rows, still_to_play) = compute_rule(data, &data.scenario.tables[rule], &|_| true);
    Table {
        rule,
        rows,
        still_to_play,
    }
}

/// Computes the rows of a table by `r` over the contests that pass `keep`
/// as well as the rule's own sport and discipline (a medal table for one
/// sport or one day), with how many counted contests are still to play.
pub fn compute_rule(
    data: &Dataset,
    r: &TableRule,
    keep: &dyn Fn(usize) -> bool,
) -> (Vec<TableRow>, usize) {
    let awards = data.awards();
    let mut rows: Vec<TableRow> = (0..data.groups.len())
        .map(|group| TableRow {
            group,
            rank: 0,
            played: 0,
            won: 0,
            drawn: 0,
            lost: 0,
            scored: 0,
            conceded: 0,
            away_scored: 0,
            points: 0,
            awards: vec![0; awards.len()],
        })
        .collect();
    let mut entered = vec![false; data.groups.len()];
    let mut still_to_play = 0;
    let counted: Vec<usize> = (0..data.contests.len())
        .filter(|&ci| counts_towards(r, &data.contests[ci]) && keep(ci))
        .collect();
    for &ci in &counted {
        let c = &data.contests[ci];
        for e in &c.entries {
            if let Some(g) = data.entry_group(e) {
                entered[g] = true;
            }
        }
        // An abandoned contest's result does not count, and it is not
        // waiting to be played either unless it is rescheduled.
        if c.status != Status::Final {
            if c.status != Status::Abandoned {
                still_to_play += 1;
            }
            continue;
        }
        let line = data.score_line(ci);
        let firsts = c.entries.iter().filter(|e| e.place == Some(1)).count();
        for (ei, e) in c.entries.iter().enumerate() {
            let Some(g) = data.entry_group(e) else {
                continue;
            };
            let row = &mut rows[g];
            if let Some(a) = e
                .award
                .as_deref()
                .and_then(|a| awards.iter().position(|x| x == a))
            {
                row.awards[a] += 1;
            }
            let outcome = match line {
                Some(l) => {
                    if let Some((h, a)) = l.scores() {
                        let (mine, theirs) = if ei == l.home { (h, a) } else { (a, h) };
                        row.scored += mine;
                        row.conceded += theirs;
                        if ei == l.away {
                            row.away_scored += mine;
                        }
                    }
                    data.outcome_for(ci, ei)
                }
                // A contest of many: first place wins, a shared first is
                // a draw, any other place (or none) loses.
                None => match e.place {
                    Some(1) if firsts == 1 => Some(Outcome::Won),
                    Some(1) => Some(Outcome::Drawn),
                    _ => Some(Outcome::Lost),
                },
            };
            match outcome {
                Some(Outcome::Won) => {
                    row.won += 1;
                    row.points += r.points.win;
                }
                Some(Outcome::Drawn) => {
                    row.drawn += 1;
                    row.points += r.points.draw;
                }
                Some(Outcome::Lost) => {
                    row.lost += 1;
                    row.points += r.points.loss;
                }
                None => continue,
            }
            row.played += 1;
        }
    }
    let mut rows: Vec<TableRow> = match r.count {
        TableCount::Results => rows.into_iter().filter(|x| entered[x.group]).collect(),
        TableCount::Awards => rows.into_iter().filter(|x| x.total() > 0).collect(),
    };
    let keys: Vec<Key> = r
        .order
        .iter()
        .filter_map(|k| parse_key(k, r.count, awards).ok())
        .collect();
    order_rows(data, r, &counted, &keys, &mut rows);
    (rows, still_to_play)
}

/// The rule of a medal table (or of seat totals): the scenario's awards
/// counted, ordered by the first award, then the second, and so on.
pub fn awards_rule(data: &Dataset) -> TableRule {
    TableRule {
        id: "awards".into(),
        name: "awards".into(),
        count: TableCount::Awards,
        sport: None,
        discipline: None,
        points: PointsRule::default(),
        order: data.awards().to_vec(),
    }
}

/// Orders rows by the keys, each key separating only rows level on every
/// key before it; rows level on all keys share a place and are listed by
/// name.
fn order_rows(
    data: &Dataset,
    rule: &TableRule,
    counted: &[usize],
    keys: &[Key],
    rows: &mut Vec<TableRow>,
) {
    let name = |r: &TableRow| crate::understand::normalize::normalize(&data.groups[r.group].name);
    // Blocks of rows still level, best block first.
    let mut blocks: Vec<Vec<TableRow>> = vec![std::mem::take(rows)];
    for &key in keys {
        let mut next = Vec::with_capacity(blocks.len());
        for block in blocks {
            if block.len() < 2 {
                next.push(block);
                continue;
            }
            let mini = (key == Key::HeadToHead).then(|| head_to_head(data, rule, counted, &block));
            let mut valued: Vec<(Vec<i64>, String, TableRow)> = block
                .into_iter()
                .map(|row| {
                    let v = match key {
                        Key::Name => Vec::new(),
                        Key::HeadToHead => mini
                            .as_ref()
                            .and_then(|m| m.get(&row.group).cloned())
                            .unwrap_or_default(),
                        k => vec![value(&row, k)],
                    };
                    (v, name(&row), row)
                })
                .collect();
            // Higher values first; by name for the `name` key.
            valued.sort_by(|a, b| {
                if key == Key::Name {
                    a.1.cmp(&b.1)
                } else {
                    b.0.cmp(&a.0)
                }
            });
            let mut current: Vec<TableRow> = Vec::new();
            let mut last: Option<(Vec<i64>, String)> = None;
            for (v, n, row) in valued {
                let same = match &last {
                    None => true,
                    Some((lv, ln)) => {
                        if key == Key::Name {
                            *ln == n
                        } else {
                            *lv == v
                        }
                    }
                };
                if !same {
                    next.push(std::mem::take(&mut current));
                }
                last = Some((v, n));
                current.push(row);
            }
            next.push(current);
        }
        blocks = next;
    }
    let mut placed = 0u32;
    for mut block in blocks {
        block.sort_by_key(|r| name(r));
        let rank = placed + 1;
        placed += block.len() as u32;
        for mut row in block {
            row.rank = rank;
            rows.push(row);
        }
    }
}

/// A row's value for a key, higher being better.
fn value(row: &TableRow, key: Key) -> i64 {
    match key {
        Key::Points => row.points,
        Key::Won => row.won as i64,
        Key::Drawn => row.drawn as i64,
        Key::Lost => -(row.lost as i64),
        Key::Scored => row.scored as i64,
        Key::Conceded => -(row.conceded as i64),
        Key::Difference => row.difference(),
        Key::AwayScored => row.away_scored as i64,
        Key::Award(k) => row.awards.get(k).copied().unwrap_or(0) as i64,
        Key::Total => row.total() as i64,
        Key::HeadToHead | Key::Name => 0,
    }
}

/// Points, difference and scored of each row in the final two-sided
/// contests between the rows of `block` only.
fn head_to_head(
    data: &Dataset,
    rule: &TableRule,
    counted: &[usize],
    block: &[TableRow],
) -> HashMap<usize, Vec<i64>> {
    let members: HashSet<usize> = block.iter().map(|r| r.group).collect();
    // (points, scored, conceded) per group.
    let mut tally: HashMap<usize, (i64, i64, i64)> =
        members.iter().map(|&g| (g, (0, 0, 0))).collect();
    for &ci in counted {
        let c = &data.contests[ci];
        if c.status != Status::Final || !sides::two_sided(c) {
            continue;
        }
        let Some(line) = data.score_line(ci) else {
            continue;
        };
        let (Some(h), Some(a)) = (
            data.entry_group(&c.entries[line.home]),
            data.entry_group(&c.entries[line.away]),
        ) else {
            continue;
        };
        if !members.contains(&h) || !members.contains(&a) {
            continue;
        }
        let Some((hs, as_)) = line.scores() else {
            continue;
        };
        for (g, ei, mine, theirs) in [(h, line.home, hs, as_), (a, line.away, as_, hs)] {
            let t = tally.get_mut(&g).expect("a member of the block");
            t.1 += mine as i64;
            t.2 += theirs as i64;
            t.0 += match data.outcome_for(ci, ei) {
                Some(Outcome::Won) => rule.points.win,
                Some(Outcome::Drawn) => rule.points.draw,
                Some(Outcome::Lost) => rule.points.loss,
                None => 0,
            };
        }
    }
    tally
        .into_iter()
        .map(|(g, (p, s, c))| (g, vec![p, s - c, s]))
        .collect()
}

impl Dataset {
    /// The computed table with this id.
    pub fn table(&self, id: &str) -> Option<&Table> {
        self.tables
            .iter()
            .find(|t| self.scenario.tables[t.rule].id == id)
    }

    /// The rules a computed table follows.
    pub fn table_rule(&self, t: &Table) -> &TableRule {
        &self.scenario.tables[t.rule]
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::dataset::sides::testing::league;
    use crate::dataset::LoadError;

    const LEAGUE: &str = r#""tables":[{"id":"league","name":"League table","count":"results","sport":"football","discipline":"league","order":["points","difference","scored","head_to_head"]}]"#;

    fn rows(d: &Dataset, id: &str) -> Vec<(String, u32, i64)> {
        d.table(id)
            .unwrap()
            .rows
            .iter()
            .map(|r| (d.groups[r.group].id.clone(), r.rank, r.points))
            .collect()
    }

    #[test]
    fn points_are_three_for_a_win_one_for_a_draw_by_default() {
        let d = league(
            &["ash", "birch", "cedar"],
            &[
                ("m1", "ash", "birch", "final", Some((2, 0))),
                ("m2", "birch", "cedar", "final", Some((1, 1))),
                ("m3", "cedar", "ash", "scheduled", None),
            ],
            LEAGUE,
        )
        .unwrap();
        assert_eq!(
            rows(&d, "league"),
            vec![
                ("ash".to_string(), 1, 3),
                ("cedar".to_string(), 2, 1),
                ("birch".to_string(), 3, 1)
            ]
        );
        let t = d.table("league").unwrap();
        let birch = t.row_of(d.group("birch").unwrap()).unwrap();
        assert_eq!(
            (birch.played, birch.won, birch.drawn, birch.lost),
            (2, 0, 1, 1)
        );
        assert_eq!(
            (birch.scored, birch.conceded, birch.difference()),
            (1, 3, -2)
        );
        assert_eq!(t.still_to_play, 1);
    }

    #[test]
    fn declared_points_replace_the_defaults() {
        let rule = LEAGUE.replace(
            r#""count":"results","#,
            r#""count":"results","points":{"win":2,"draw":1},"#,
        );
        let d = league(
            &["ash", "birch"],
            &[("m1", "ash", "birch", "final", Some((2, 0)))],
            &rule,
        )
        .unwrap();
        assert_eq!(rows(&d, "league")[0], ("ash".to_string(), 1, 2));
    }

    #[test]
    fn head_to_head_separates_rows_level_on_the_keys_before_it() {
        // Ash and Birch are level on points, difference and scored; Ash won
        // their meeting.
        let d = league(
            &["ash", "birch", "cedar"],
            &[
                ("m1", "ash", "birch", "final", Some((1, 0))),
                ("m2", "birch", "cedar", "final", Some((2, 0))),
                ("m3", "cedar", "ash", "final", Some((1, 0))),
            ],
            LEAGUE,
        )
        .unwrap();
        // Every side: 3 points; ash 1-1, birch 2-1, cedar 1-2.
        assert_eq!(
            rows(&d, "league"),
            vec![
                ("birch".to_string(), 1, 3),
                ("ash".to_string(), 2, 3),
                ("cedar".to_string(), 3, 3)
            ]
        );
    }

    #[test]
    fn rows_level_on_every_key_share_a_place_and_the_next_place_skips() {
        let d = league(
            &["ash", "birch", "cedar", "dale"],
            &[
                ("m1", "ash", "cedar", "final", Some((1, 0))),
                ("m2", "birch", "dale", "final", Some((1, 0))),
            ],
            LEAGUE,
        )
        .unwrap();
        assert_eq!(
            rows(&d, "league"),
            vec![
                ("ash".to_string(), 1, 3),
                ("birch".to_string(), 1, 3),
                ("cedar".to_string(), 3, 0),
                ("dale".to_string(), 3, 0)
            ]
        );
        // With the name as the last key, every row has a place of its own.
        let named = LEAGUE.replace(r#""head_to_head"]"#, r#""head_to_head","name"]"#);
        let d = league(
            &["ash", "birch"],
            &[("m1", "ash", "birch", "final", Some((1, 1)))],
            &named,
        )
        .unwrap();
        assert_eq!(
            rows(&d, "league"),
            vec![("ash".to_string(), 1, 1), ("birch".to_string(), 2, 1)]
        );
    }

    #[test]
    fn abandoned_and_postponed_matches_do_not_count() {
        let d = league(
            &["ash", "birch"],
            &[
                ("m1", "ash", "birch", "abandoned", Some((3, 0))),
                ("m2", "birch", "ash", "postponed", None),
                ("m3", "ash", "birch", "live", Some((0, 1))),
            ],
            LEAGUE,
        )
        .unwrap();
        let t = d.table("league").unwrap();
        assert!(t.rows.iter().all(|r| r.played == 0 && r.points == 0));
        assert_eq!(t.still_to_play, 2);
    }

    #[test]
    fn the_medal_table_is_a_table_of_awards_ordered_gold_silver_bronze() {
        let mut d = crate::dataset::demo();
        d.scenario.tables = serde_json::from_str(
            r#"[{"id":"medals","name":"medal table","count":"awards","order":["gold","silver","bronze"]}]"#,
        )
        .unwrap();
        let t = compute(&d, 0);
        let ours: Vec<(usize, u32, Vec<u32>)> = t
            .rows
            .iter()
            .map(|r| (r.group, r.rank, r.awards.clone()))
            .collect();
        // Counted here the plain way: medals per delegation from the final
        // contests, golds first, then silvers, then bronzes, equal counts
        // sharing a rank (standard competition ranking).
        let mut counts = vec![vec![0u32; 3]; d.groups.len()];
        for c in d.contests.iter().filter(|c| c.status == Status::Final) {
            for e in &c.entries {
                if let (Some(a), Some(g)) = (&e.award, d.entry_group(e)) {
                    let k = ["gold", "silver", "bronze"]
                        .iter()
                        .position(|x| x == a)
                        .unwrap();
                    counts[g][k] += 1;
                }
            }
        }
        let mut theirs: Vec<(usize, u32, Vec<u32>)> = counts
            .into_iter()
            .enumerate()
            .filter(|(_, c)| c.iter().sum::<u32>() > 0)
            .map(|(g, c)| (g, 0, c))
            .collect();
        theirs.sort_by(|a, b| {
            b.2.cmp(&a.2)
                .then(d.groups[a.0].name.cmp(&d.groups[b.0].name))
        });
        for i in 0..theirs.len() {
            theirs[i].1 = if i > 0 && theirs[i].2 == theirs[i - 1].2 {
                theirs[i - 1].1
            } else {
                i as u32 + 1
            };
        }
        assert!(theirs.len() > 3);
        assert_eq!(ours, theirs);
    }

    #[test]
    fn seat_totals_are_a_table_of_one_award() {
        let dir = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("dataset-demo/election");
        let mut d = crate::dataset::load_dir(&dir).unwrap();
        // At the start of the night no seat is called: no rows.
        d.scenario.tables = serde_json::from_str(
            r#"[{"id":"seats","name":"seats","count":"awards","order":["seat"]}]"#,
        )
        .unwrap();
        assert!(compute(&d, 0).rows.is_empty());
        // Two wards called for one party: that party leads with two seats.
        let party = d.competitors[d
            .competitor(&d.contests[0].entries[0].competitor.clone().unwrap())
            .unwrap()]
        .group
        .clone();
        for ci in 0..2 {
            let c = &mut d.contests[ci];
            c.status = Status::Final;
            let e = c.entries.iter_mut().find(|e| {
                e.competitor.as_ref().is_some_and(|id| {
                    d.competitors
                        .iter()
                        .any(|p| &p.id == id && p.group == party)
                })
            });
            if let Some(e) = e {
                e.place = Some(1);
                e.award = Some("seat".into());
            }
        }
        let t = compute(&d, 0);
        assert_eq!(d.groups[t.rows[0].group].id, party);
        assert_eq!(t.rows[0].awards, vec![2]);
    }

    #[test]
    fn rules_are_checked_against_the_scenario() {
        let bad = r#""tables":[{"id":"x","name":"","count":"results","sport":"rugby","order":["points","total","points","colour"]},{"id":"x","name":"n","count":"awards","order":["scored"]}]"#;
        let Err(LoadError::Invalid(p)) = league(&["ash"], &[], bad) else {
            panic!("bad rules load");
        };
        let msgs: Vec<String> = p.iter().map(|p| p.to_string()).collect();
        let has = |s: &str| msgs.iter().any(|m| m.contains(s));
        assert!(has("a table needs a name"), "{msgs:?}");
        assert!(has("no sport with id \"rugby\""), "{msgs:?}");
        assert!(has("key \"total\" counts awards"), "{msgs:?}");
        assert!(has("key \"points\" listed twice"), "{msgs:?}");
        assert!(has("unknown key \"colour\""), "{msgs:?}");
        assert!(has("duplicate table id"), "{msgs:?}");
        assert!(has("key \"scored\" counts results"), "{msgs:?}");
        assert!(
            msgs.iter()
                .all(|m| m.starts_with("scenario.json:1:") && m.contains(": record x: ")),
            "{msgs:?}"
        );
    }
}
