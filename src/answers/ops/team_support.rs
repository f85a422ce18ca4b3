//! Helpers shared by the operations on two-sided contests and tables: a
//! team's matches in date order, how a score and a result read, and which
//! computed table an intent means.

use jiff::ZonedDateTime;

use crate::answers::value::{int_words, Style, Value};
use crate::answers::words;
use crate::dataset::sides::{Outcome, ScoreLine};
use crate::dataset::table::Table;
use crate::dataset::{Dataset, Side, Status};

/// A group's two-sided contests as (contest, entry) pairs, earliest first.
pub fn matches_of(data: &Dataset, group: usize) -> Vec<(usize, usize)> {
    let mut out: Vec<(usize, usize)> = (0..data.contests.len())
        .filter(|&ci| data.score_line(ci).is_some())
        .filter_map(|ci| data.entry_of_group(ci, group).map(|ei| (ci, ei)))
        .collect();
    out.sort_by_key(|&(ci, _)| data.facts[ci].start.timestamp());
    out
}

/// Played matches (final), latest first, limited to those started by
/// `now`.
pub fn results_of(data: &Dataset, group: usize, now: &ZonedDateTime) -> Vec<(usize, usize)> {
    let mut out: Vec<(usize, usize)> = matches_of(data, group)
        .into_iter()
        .filter(|&(ci, _)| data.contests[ci].status == Status::Final)
        .filter(|&(ci, _)| data.facts[ci].start.timestamp() <= now.timestamp())
        .collect();
    out.reverse();
    out
}

/// A score as words: "two", with "nil" for zero where the unit is the
/// goal (as football scores are read).
fn score_word(data: &Dataset, n: u64) -> String {
    if n == 0 && data.scenario.score_unit == "goal" {
        "nil".to_string()
    } else {
        words::cardinal(n)
    }
}

/// "Harrowby Town 3–2 Lanner Vale", spoken "Harrowby Town three, Lanner
/// Vale two"; without scores, "Harrowby Town v Lanner Vale".
pub fn score_value(data: &Dataset, ci: usize, line: &ScoreLine) -> Value {
    let c = &data.contests[ci];
    let home = data.entry_name(&c.entries[line.home]);
    let away = data.entry_name(&c.entries[line.away]);
    match line.scores() {
        Some((h, a)) => Value::Dual {
            text: format!("{home} {h}\u{2013}{a} {away}"),
            spoken: format!(
                "{home} {}, {away} {}",
                score_word(data, h),
                score_word(data, a)
            ),
        },
        None => Value::Text(format!("{home} v {away}")),
    }
}

/// A pair of scores, higher first unless `as_is`: "3–1", spoken
/// "three-one" ("two-nil").
pub fn pair_value(data: &Dataset, a: u64, b: u64, as_is: bool) -> Value {
    let (x, y) = if as_is || a >= b { (a, b) } else { (b, a) };
    Value::Dual {
        text: format!("{x}\u{2013}{y}"),
        spoken: format!("{}-{}", score_word(data, x), score_word(data, y)),
    }
}

/// Table points: "25 points", spoken "twenty-five points".
pub fn points_value(n: i64) -> Value {
    let unit = if n.abs() == 1 { "point" } else { "points" };
    Value::Dual {
        text: format!("{} {unit}", int_words(n, Style::Text, false)),
        spoken: format!("{} {unit}", int_words(n, Style::Spoken, false)),
    }
}

/// A number of matches: "12 games", "one game".
pub fn games_value(n: u32) -> Value {
    Value::Dual {
        text: words::count_noun(n as u64, "game", None, words::NumberStyle::Running),
        spoken: words::count_noun(n as u64, "game", None, words::NumberStyle::Words),
    }
}

/// The verb of a result: "won", "drew", "lost".
pub fn result_verb(o: Outcome) -> &'static str {
    match o {
        Outcome::Won => "won",
        Outcome::Drawn => "drew",
        Outcome::Lost => "lost",
    }
}

/// Where a side plays: "at home" or "away".
pub fn venue_word(side: Option<Side>) -> &'static str {
    match side {
        Some(Side::Away) => "away",
        _ => "at home",
    }
}

/// The other side's name in a two-sided contest.
pub fn opponent(data: &Dataset, ci: usize, ei: usize) -> Option<(usize, String)> {
    let line = data.score_line(ci)?;
    let other = line.other(ei);
    let e = &data.contests[ci].entries[other];
    Some((data.entry_group(e)?, data.entry_name(e)))
}

/// The table an intent means: its `table` setting, else the scenario's
/// first declared table.
pub fn chosen_table<'a>(
    data: &'a Dataset,
    settings: &std::collections::BTreeMap<String, String>,
) -> Option<&'a Table> {
    match settings.get("table") {
        Some(id) => data.table(id),
        None => data.tables.first(),
    }
}
