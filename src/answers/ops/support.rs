//! Helpers shared by operations: how an entry is named, how a mark and a
//! start time read, and the medal table every medal question is built on.

use jiff::{civil::Date, ZonedDateTime};

use crate::answers::value::{int_words, Style, Value};
use crate::answers::words;
use crate::dataset::{mark, Contest, Dataset, EntityRef, Entry, EntryStatus, Measure, Status};

/// The competitor's entry in the contest the reader named: `Ok(None)` when
/// no contest was named, `Err` holding the `not_entered` outcome when they
/// are not in the one named.
pub fn named_entry(
    input: &super::OpInput,
    pi: usize,
) -> Result<Option<(usize, usize)>, super::OpOutput> {
    let data = input.data;
    let Some(ci) = input.contest("contest") else {
        return Ok(None);
    };
    match data.contests_of(pi).iter().find(|(c, _)| *c == ci) {
        Some(&pair) => Ok(Some(pair)),
        None => {
            let f = super::Facts::new()
                .set("name", data.competitors[pi].name())
                .set("contest_name", data.contest_name(ci));
            Err(super::OpOutput::done(
                "not_entered",
                f,
                vec![EntityRef::Competitor(pi), EntityRef::Contest(ci)],
            ))
        }
    }
}

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

/// The gap between two entries' marks; none when they are equal (a tie
/// broken by a photo, a countback or by lot has no margin to give).
pub fn margin_value(data: &Dataset, contest: usize, a: usize, b: usize) -> Option<Value> {
    let c = &data.contests[contest];
    let marks = &data.facts[contest].marks;
    match (&marks[a], &marks[b]) {
        (Some(x), Some(y)) if mark::compare(false, x, y) == std::cmp::Ordering::Equal => None,
        (Some(x), Some(y)) => Some(Value::Dual {
            text: mark::format_margin_text(c.measure, x, y),
            spoken: mark::format_margin_spoken(c.measure, x, y),
        }),
        _ => None,
    }
}

/// Each entry's share of the votes counted in a contest measured in votes,
/// in per cent, computed from the votes themselves (never from rounded
/// shares, so rounded shares need not add up to 100, common practice).
/// Entries without a vote count, or that did not stand (withdrawn,
/// disqualified), have none. `None` when the contest is not measured in
/// votes or no vote is counted yet.
pub fn vote_shares(data: &Dataset, contest: usize) -> Option<Vec<Option<f64>>> {
    let c = &data.contests[contest];
    if c.measure != Measure::Votes {
        return None;
    }
    let marks = &data.facts[contest].marks;
    let counts: Vec<Option<f64>> = c
        .entries
        .iter()
        .zip(marks)
        .map(|(e, m)| {
            m.as_ref()
                .filter(|_| e.status == EntryStatus::Ok)
                .map(|m| m.value())
        })
        .collect();
    let total: f64 = counts.iter().flatten().sum();
    if total <= 0.0 {
        return None;
    }
    Some(
        counts
            .iter()
            .map(|v| v.map(|v| v * 100.0 / total))
            .collect(),
    )
}

/// Whether a vote count has begun without a single vote in: places and
/// "leads with 0 votes" would then be figures that say nothing, so the
/// operations treat it as no figures yet.
pub fn no_votes_yet(data: &Dataset, contest: usize) -> bool {
    data.contests[contest].measure == Measure::Votes
        && data.facts[contest]
            .marks
            .iter()
            .all(|m| m.as_ref().is_none_or(|m| m.value() == 0.0))
}

/// A share in per cent to one decimal place: "45.2%", spoken "forty-five
/// point two per cent" (one decimal is the common practice for vote shares).
pub fn percent_value(share: f64) -> Value {
    let written = format!("{:.1}", round1(share));
    Value::Dual {
        text: format!("{written}%"),
        spoken: format!("{} per cent", words::decimal_words(&written)),
    }
}

/// A gap between two shares in percentage points, one decimal place: "3.4
/// points", spoken "three point four points" (a difference of percentages
/// is in points, not per cent: common practice).
pub fn points_value(points: f64) -> Value {
    let written = format!("{:.1}", round1(points));
    Value::Dual {
        text: format!("{written} points"),
        spoken: format!("{} points", words::decimal_words(&written)),
    }
}

/// Rounds half away from zero to one decimal, the way results are printed
/// (`format!` alone rounds the binary value: 0.25 would print "0.2").
fn round1(x: f64) -> f64 {
    (x * 10.0).round() / 10.0
}

/// How much of the expected count is in, in whole per cent rounded down:
/// "62%", spoken "sixty-two per cent". Rounded down so a count that is not
/// finished never reads "100%".
pub fn counted_value(counted: f64) -> Value {
    let pct = (counted.clamp(0.0, 1.0) * 100.0 + 1e-9).floor() as u64;
    let pct = if counted < 1.0 { pct.min(99) } else { 100 };
    Value::Dual {
        text: format!("{pct}%"),
        spoken: format!("{} per cent", words::cardinal(pct)),
    }
}

/// The facts every vote-counted answer can add: the share of one entry
/// (`share`), and how much of the count is in (`counted`).
pub fn vote_facts(data: &Dataset, contest: usize, entry: Option<usize>, f: &mut super::Facts) {
    if let (Some(shares), Some(e)) = (vote_shares(data, contest), entry) {
        if let Some(s) = shares[e] {
            f.put("share", percent_value(s));
        }
    }
    if let Some(n) = data.contests[contest].counted {
        f.put("counted", counted_value(n));
    }
}

/// The gap in percentage points between two entries' vote shares.
pub fn margin_points(data: &Dataset, contest: usize, a: usize, b: usize) -> Option<Value> {
    let shares = vote_shares(data, contest)?;
    match (shares[a], shares[b]) {
        (Some(x), Some(y)) if x == y => None,
        (Some(x), Some(y)) => Some(points_value((x - y).abs())),
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
    // The 24-hour clock read aloud (common practice): an hour before ten
    // with a leading "oh" ("oh one hundred", "oh nine thirty"), the hour
    // after midnight as "zero" ("zero fifteen"), and 00:00 as "midnight".
    let hour = match h {
        0 => "zero".to_string(),
        1..=9 => format!("oh {}", words::cardinal(h)),
        _ => words::cardinal(h),
    };
    let spoken = match (h, m) {
        (0, 0) => "midnight".to_string(),
        (_, 0) => format!("{hour} hundred"),
        (_, 1..=9) => format!("{hour} oh {}", words::cardinal(m)),
        _ => format!("{hour} {}", words::cardinal(m)),
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
    medal_table_of(data, &|_| true)
}

/// The medal table over the contests that pass `keep` (one sport, one
/// day), ranked the same way.
pub fn medal_table_of(data: &Dataset, keep: &dyn Fn(usize) -> bool) -> Vec<MedalRow> {
    // The same computed table as any declared one (`dataset::table`),
    // with the awards as its keys in rank order.
    let rule = crate::dataset::table::awards_rule(data);
    crate::dataset::table::compute_rule(data, &rule, keep)
        .0
        .into_iter()
        .map(|r| MedalRow {
            group: r.group,
            counts: r.awards,
            rank: r.rank,
        })
        .collect()
}

/// How many contests that give awards are not decided yet: "so far" in
/// "three seats so far" needs it.
pub fn awards_still_open(data: &Dataset) -> usize {
    (0..data.contests.len())
        .filter(|&c| data.awards_in(c) && data.contests[c].status != Status::Final)
        .count()
}

/// A limit on which contests count, read from optional `sport` and `date`
/// slots: the filter, and how a reply says it ("in swimming", "on Friday 13
/// August", "in swimming yesterday"); `None` when neither is given.
pub fn contest_scope<'a>(
    input: &super::OpInput<'a>,
) -> (Box<dyn Fn(usize) -> bool + 'a>, Option<Value>) {
    let data = input.data;
    let sport = match input.entity("sport") {
        Some(EntityRef::Sport(s)) => Some(s),
        _ => None,
    };
    let date = match input.slots.get("date") {
        Some(super::SlotValue::Date { value }) => Some(*value),
        _ => None,
    };
    let keep = move |ci: usize| {
        sport.is_none_or(|s| data.discipline_ref(ci).0 == s)
            && date.is_none_or(|d| data.facts[ci].start.date() == d)
    };
    let mut parts: Vec<Value> = Vec::new();
    if let Some(s) = sport {
        parts.push(Value::Text(format!("in {}", data.sports[s].name)));
    }
    if let Some(d) = date {
        parts.push(day_value(d, input.now));
    }
    let scope = match parts.len() {
        0 => None,
        1 => parts.pop(),
        _ => {
            let day = parts.pop().expect("two parts");
            let sport = parts.pop().expect("two parts");
            Some(sport.then(" ", &day))
        }
    };
    (Box::new(keep), scope)
}

/// A count of one award: "two golds", "one silver", "three seats", "no
/// gold".
pub fn award_count(award: &str, n: u32) -> Value {
    if n == 0 {
        return Value::Text(format!("no {award}"));
    }
    let noun = if n == 1 {
        award.to_string()
    } else {
        words::plural(award)
    };
    Value::Dual {
        text: format!("{} {noun}", int_words(n as i64, Style::Text, false)),
        spoken: format!("{} {noun}", int_words(n as i64, Style::Spoken, false)),
    }
}

/// How a round reads after an event's name: "heats", "semifinals",
/// "final".
pub fn round_plural(r: &str) -> String {
    match r {
        "final" => "final".into(),
        other => crate::answers::words::plural(other),
    }
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

/// A medal count in words, "three gold, one silver and two bronze" ("three
/// seats" when the scenario has a single award); zero
/// counts are left out unless `zeros` (a table row lists every colour).
pub fn breakdown(data: &Dataset, counts: &[u32], zeros: bool) -> Value {
    let phrase = |style: Style| {
        let parts: Vec<String> = data
            .awards()
            .iter()
            .zip(counts)
            .filter(|(_, &n)| zeros || n > 0)
            .map(|(a, &n)| {
                // Several awards read as colours ("three gold"); a single
                // kind of award is the thing counted ("three seats").
                let noun = if data.awards().len() == 1 && n != 1 {
                    words::plural(a)
                } else {
                    a.clone()
                };
                format!("{} {noun}", int_words(n as i64, style, false))
            })
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

/// The time of a contest's last update on the 24-hour clock ("21:02"), if
/// the data give one.
pub fn updated_value(data: &Dataset, ci: usize) -> Option<Value> {
    data.facts[ci].updated.map(|t| {
        let z = t.to_zoned_datetime(data.tz.clone());
        clock_value(z.hour() as u64, z.minute() as u64)
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
    fn the_24_hour_clock_read_aloud() {
        // Common practice for reading the 24-hour clock aloud.
        let said = |h, m| clock_value(h, m).render(Style::Spoken);
        assert_eq!(said(21, 4), "twenty-one oh four");
        assert_eq!(said(22, 0), "twenty-two hundred");
        assert_eq!(said(18, 30), "eighteen thirty");
        assert_eq!(said(1, 0), "oh one hundred");
        assert_eq!(said(9, 45), "oh nine forty-five");
        assert_eq!(said(0, 15), "zero fifteen");
        assert_eq!(said(0, 0), "midnight");
        assert_eq!(clock_value(1, 5).render(Style::Text), "01:05");
    }

    #[test]
    fn shares_and_points_read_to_one_decimal() {
        // One decimal place for vote shares, and margins between shares in
        // percentage points: common practice in results reporting.
        let r = |v: Value| (v.render(Style::Text), v.render(Style::Spoken));
        assert_eq!(
            r(percent_value(43.86)),
            ("43.9%".into(), "forty-three point nine per cent".into())
        );
        // Half away from zero, as printed results round (0.25 is 0.3).
        assert_eq!(r(percent_value(0.25)).0, "0.3%");
        assert_eq!(r(percent_value(100.0)).0, "100.0%");
        assert_eq!(
            r(points_value(11.05)),
            ("11.1 points".into(), "eleven point one points".into())
        );
    }

    #[test]
    fn an_unfinished_count_never_reads_one_hundred_per_cent() {
        let r = |v: Value| v.render(Style::Text);
        assert_eq!(r(counted_value(0.0)), "0%");
        assert_eq!(r(counted_value(0.6)), "60%");
        assert_eq!(r(counted_value(0.916)), "91%");
        assert_eq!(r(counted_value(0.999)), "99%");
        assert_eq!(r(counted_value(1.0)), "100%");
        assert_eq!(
            counted_value(0.35).render(Style::Spoken),
            "thirty-five per cent"
        );
    }

    #[test]
    fn vote_shares_come_from_the_votes_and_need_not_sum_to_one_hundred() {
        // Three candidates on 1, 1 and 1 votes: each 33.3%, which rounded
        // add up to 99.9; the shares are not forced to 100 (common practice).
        let dir = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("dataset-demo/election");
        let data = crate::dataset::load_dir(&dir).unwrap();
        let mut r = crate::dataset::changes::Records::of(&data);
        let c = r
            .contests
            .iter_mut()
            .find(|c| c.entries.len() == 3)
            .unwrap();
        c.status = Status::Live;
        for e in c.entries.iter_mut() {
            e.place = Some(1);
            e.mark = Some("1".into());
        }
        let id = c.id.clone();
        let Ok(data) = r.build(2) else {
            panic!("the changed records should load");
        };
        let ci = data.contests.iter().position(|c| c.id == id).unwrap();
        let shares = vote_shares(&data, ci).unwrap();
        let printed: Vec<String> = shares
            .iter()
            .map(|s| percent_value(s.unwrap()).render(Style::Text))
            .collect();
        assert_eq!(printed, ["33.3%", "33.3%", "33.3%"]);
        // Level on votes: no margin to give, not "0.0 points".
        assert_eq!(margin_points(&data, ci, 0, 1), None);
        assert_eq!(margin_value(&data, ci, 0, 1), None);
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
