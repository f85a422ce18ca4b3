//! Helpers shared by operations: how an entry is named, how a mark and a
//! start time read, and the medal table every medal question is built on.

use jiff::{civil::Date, ZonedDateTime};

use crate::answers::value::{int_words, Style, Value};
use crate::answers::words;
use crate::dataset::{mark, Contest, Dataset, EntityRef, Entry, EntryStatus, Status};

/// "Zoë Ardent (Brellmoor)" for a person, "Brellmoor" for a team.
pub fn entry_label(data: &Dataset, e: &Entry) -> String {
    match e.competitor.as_deref().and_then(|c| data.competitor(c)) {
        Some(ci) => {
            let who = &data.competitors[ci];
            match data.group(&who.group) {
                Some(g) => format!("{} ({})", who.name(), data.groups[g].name),
                None => who.name(),
            }
        }
        None => data.entry_name(e),
    }
}

/// An entry's label as a value: "Zoë Ardent (Brellmoor)" written, "Zoë
/// Ardent of Brellmoor" spoken (brackets read oddly aloud).
pub fn entry_value(data: &Dataset, e: &Entry) -> Value {
    match e.competitor.as_deref().and_then(|c| data.competitor(c)) {
        Some(ci) => {
            let who = &data.competitors[ci];
            match data.group(&who.group) {
                Some(g) => Value::Dual {
                    text: format!("{} ({})", who.name(), data.groups[g].name),
                    spoken: format!("{} of {}", who.name(), data.groups[g].name),
                },
                None => Value::Text(who.name()),
            }
        }
        None => Value::Text(data.entry_name(e)),
    }
}

/// The entity an entry stands for.
pub fn entry_entity(data: &Dataset, e: &Entry) -> Option<EntityRef> {
    if let Some(ci) = e.competitor.as_deref().and_then(|c| data.competitor(c)) {
        return Some(EntityRef::Competitor(ci));
    }
    data.entry_group(e).map(EntityRef::Group)
}

/// The entry's mark as a value with a written and a spoken form.
pub fn mark_value(data: &Dataset, contest: usize, entry: usize) -> Option<Value> {
    let c = &data.contests[contest];
    data.facts[contest].marks[entry]
        .as_ref()
        .map(|m| Value::Dual {
            text: mark::format_text(c.measure, m),
            spoken: mark::format_spoken(c.measure, m),
        })
}

/// The gap between two entries' marks.
pub fn margin_value(data: &Dataset, contest: usize, a: usize, b: usize) -> Option<Value> {
    let c = &data.contests[contest];
    let marks = &data.facts[contest].marks;
    match (&marks[a], &marks[b]) {
        (Some(x), Some(y)) => Some(Value::Dual {
            text: mark::format_margin_text(c.measure, x, y),
            spoken: mark::format_margin_spoken(c.measure, x, y),
        }),
        _ => None,
    }
}

/// Indices of placed entries, best first (ties keep file order).
pub fn placed(c: &Contest) -> Vec<usize> {
    let mut v: Vec<usize> = (0..c.entries.len())
        .filter(|&i| c.entries[i].place.is_some())
        .collect();
    v.sort_by_key(|&i| c.entries[i].place);
    v
}

/// Entries holding an award in a final contest.
pub fn holders(c: &Contest, award: &str) -> Vec<usize> {
    if c.status != Status::Final {
        return Vec::new();
    }
    (0..c.entries.len())
        .filter(|&i| c.entries[i].award.as_deref() == Some(award))
        .collect()
}

/// Labels of several entries as one list value.
pub fn labels(data: &Dataset, c: &Contest, ix: &[usize]) -> Value {
    Value::List(
        ix.iter()
            .map(|&i| entry_value(data, &c.entries[i]))
            .collect(),
    )
}

/// How a non-finishing status reads: "did not finish".
pub fn status_phrase(s: EntryStatus) -> &'static str {
    match s {
        EntryStatus::Ok => "finished",
        EntryStatus::Dnf => "did not finish",
        EntryStatus::Dns => "did not start",
        EntryStatus::Dsq => "was disqualified",
    }
}

/// A day relative to now: "today", "tomorrow", "yesterday", else "on
/// Sunday 15 August".
pub fn day_phrase(day: Date, now: &ZonedDateTime) -> String {
    let today = now.date();
    if day == today {
        "today".into()
    } else if Some(day) == today.tomorrow().ok() {
        "tomorrow".into()
    } else if Some(day) == today.yesterday().ok() {
        "yesterday".into()
    } else {
        format!("on {}", day.strftime("%A %-d %B"))
    }
}

/// A start time relative to now: "today at 19:40". The spoken form says
/// the clock time in words ("nineteen forty"), as the 24-hour clock is read
/// in the newsroom's region (common practice).
pub fn when_value(start: &ZonedDateTime, now: &ZonedDateTime) -> Value {
    day_value(start.date(), now).then(
        " at ",
        &clock_value(start.hour() as u64, start.minute() as u64),
    )
}

/// A day relative to now as a value. A named day ("on Monday 16 August")
/// is said "on Monday the sixteenth of August", and in SSML its day of the
/// month is marked as a date (`format="d"`, W3C say-as Note) with the
/// ordinal written "16th", which engines with and without `say-as`
/// support both read as "sixteenth"; "today" and "tomorrow" are words
/// already.
pub fn day_value(date: Date, now: &ZonedDateTime) -> Value {
    let day = day_phrase(date, now);
    if !day.starts_with("on ") {
        return Value::Said {
            text: day.clone(),
            spoken: day.clone(),
            ssml: day,
        };
    }
    let d = date.day() as u64;
    let month = date.strftime("%B").to_string();
    Value::Said {
        spoken: format!(
            "on {} the {} of {month}",
            weekday_name(date),
            words::ordinal(d)
        ),
        ssml: format!(
            "on {} the <say-as interpret-as=\"date\" format=\"d\">{}</say-as> of {month}",
            weekday_name(date),
            words::ordinal_figure(d)
        ),
        text: day,
    }
}

/// A time of day on the 24-hour clock as a value: "20:50", "twenty fifty".
/// Speech gets the words, SSML included: `say-as` time is read digit by
/// digit by some engines ("twenty-one zero four"), which is not how the
/// newsroom says it.
pub fn clock_value(h: u64, m: u64) -> Value {
    let spoken = match m {
        0 => format!("{} hundred", words::cardinal(h)),
        1..=9 => format!("{} oh {}", words::cardinal(h), words::cardinal(m)),
        _ => format!("{} {}", words::cardinal(h), words::cardinal(m)),
    };
    Value::Dual {
        text: format!("{h:02}:{m:02}"),
        spoken,
    }
}

fn weekday_name(d: Date) -> &'static str {
    use jiff::civil::Weekday::*;
    match d.weekday() {
        Monday => "Monday",
        Tuesday => "Tuesday",
        Wednesday => "Wednesday",
        Thursday => "Thursday",
        Friday => "Friday",
        Saturday => "Saturday",
        Sunday => "Sunday",
    }
}

/// One line of the medal table.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct MedalRow {
    pub group: usize,
    /// Count per award, in the scenario's award order.
    pub counts: Vec<u32>,
    /// Rank by standard competition ranking ("1224").
    pub rank: u32,
}

impl MedalRow {
    pub fn total(&self) -> u32 {
        self.counts.iter().sum()
    }
}

/// The medal table: groups with at least one award, ordered by the first
/// award, then the second, and so on, then by name. Groups with identical
/// counts share a rank, and the next rank skips (1, 2, 2, 4): standard
/// competition ranking, common practice for medal tables.
pub fn medal_table(data: &Dataset) -> Vec<MedalRow> {
    let awards = data.awards();
    let mut counts = vec![vec![0u32; awards.len()]; data.groups.len()];
    for c in data.contests.iter().filter(|c| c.status == Status::Final) {
        for e in &c.entries {
            let (Some(a), Some(g)) = (e.award.as_deref(), data.entry_group(e)) else {
                continue;
            };
            if let Some(k) = awards.iter().position(|x| x == a) {
                counts[g][k] += 1;
            }
        }
    }
    let mut rows: Vec<MedalRow> = counts
        .into_iter()
        .enumerate()
        .filter(|(_, c)| c.iter().any(|&n| n > 0))
        .map(|(group, counts)| MedalRow {
            group,
            counts,
            rank: 0,
        })
        .collect();
    rows.sort_by(|a, b| {
        b.counts
            .cmp(&a.counts)
            .then_with(|| data.groups[a.group].name.cmp(&data.groups[b.group].name))
    });
    assign_ranks(&mut rows);
    rows
}

/// Standard competition ranking over rows already in order.
pub fn assign_ranks(rows: &mut [MedalRow]) {
    for i in 0..rows.len() {
        rows[i].rank = if i > 0 && rows[i].counts == rows[i - 1].counts {
            rows[i - 1].rank
        } else {
            i as u32 + 1
        };
    }
}

/// Values for a medal count: one fact per award plus a total.
pub fn medal_facts(data: &Dataset, counts: &[u32], facts: &mut super::Facts) {
    for (k, a) in data.awards().iter().enumerate() {
        facts.put(a, Value::Int(counts.get(k).copied().unwrap_or(0) as i64));
    }
    facts.put("total", Value::Int(counts.iter().sum::<u32>() as i64));
    facts.put("breakdown", breakdown(data, counts, false));
}

/// A medal count in words, "three gold, one silver and two bronze"; zero
/// counts are left out unless `zeros` (a table row lists every colour).
pub fn breakdown(data: &Dataset, counts: &[u32], zeros: bool) -> Value {
    let phrase = |style: Style| {
        let parts: Vec<String> = data
            .awards()
            .iter()
            .zip(counts)
            .filter(|(_, &n)| zeros || n > 0)
            .map(|(a, &n)| format!("{} {a}", int_words(n as i64, style, false)))
            .collect();
        words::join_list(&parts, "and")
    };
    Value::Dual {
        text: phrase(Style::Text),
        spoken: phrase(Style::Spoken),
    }
}

/// "1st" or "joint 2nd" for a rank shared with others.
pub fn rank_value(rank: u32, shared: bool) -> Value {
    Value::ordinal_with(rank as u64, if shared { "joint" } else { "" })
}

/// How old a live contest's figures are, when older than `stale_after`:
/// "38 minutes ago" (from its last update, or the data's `as_of` when it
/// has none). `None` while they are fresh, or when the contest is not live.
pub fn staleness(
    data: &Dataset,
    ci: usize,
    now: &ZonedDateTime,
    stale_after: std::time::Duration,
) -> Option<Value> {
    if data.contests[ci].status != Status::Live {
        return None;
    }
    let updated = data.facts[ci].updated.unwrap_or(data.as_of);
    let age = now.timestamp().as_second() - updated.as_second();
    if age < 0 || (age as u64) < stale_after.as_secs() {
        return None;
    }
    let minutes = (age / 60) as u64;
    let phrase = |style: Style| {
        let (n, unit) = if minutes < 120 {
            (minutes, "minute")
        } else {
            (minutes / 60, "hour")
        };
        let num = int_words(n as i64, style, false);
        let unit = if n == 1 {
            unit.to_string()
        } else {
            words::plural(unit)
        };
        format!("{num} {unit} ago")
    };
    Some(Value::Dual {
        text: phrase(Style::Text),
        spoken: phrase(Style::Spoken),
    })
}

/// Name, start and venue of a contest.
pub fn contest_facts(data: &Dataset, ci: usize, now: &ZonedDateTime, f: &mut super::Facts) {
    f.put("contest_name", data.contest_name(ci));
    f.put("start", when_value(&data.facts[ci].start, now));
    if let Some(v) = &data.contests[ci].venue {
        f.put("venue", v.as_str());
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn row(g: usize, c: [u32; 3]) -> MedalRow {
        MedalRow {
            group: g,
            counts: c.to_vec(),
            rank: 0,
        }
    }

    #[test]
    fn ties_share_a_rank_and_the_next_rank_skips() {
        // Standard competition ranking ("1224"), common practice.
        let mut rows = vec![
            row(0, [3, 1, 0]),
            row(1, [2, 0, 1]),
            row(2, [2, 0, 1]),
            row(3, [1, 5, 5]),
        ];
        assign_ranks(&mut rows);
        let ranks: Vec<u32> = rows.iter().map(|r| r.rank).collect();
        assert_eq!(ranks, vec![1, 2, 2, 4]);
    }
}
