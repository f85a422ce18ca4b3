//! Days and small numbers in reader text: "today", "tomorrow", "on
//! Saturday", "15 August", "2027-08-15"; "top five", "top 3".

use jiff::civil::{Date, Weekday};

/// A day named in the text, with the tokens it covers.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct DayMention {
    pub start: usize,
    pub end: usize,
    pub date: Date,
}

const WEEKDAYS: [(&str, Weekday); 7] = [
    ("monday", Weekday::Monday),
    ("tuesday", Weekday::Tuesday),
    ("wednesday", Weekday::Wednesday),
    ("thursday", Weekday::Thursday),
    ("friday", Weekday::Friday),
    ("saturday", Weekday::Saturday),
    ("sunday", Weekday::Sunday),
];

/// Parts of a day that may follow a day ("tomorrow night", "on Friday
/// evening") and stay part of it.
const PARTS_OF_DAY: &[&str] = &["morning", "afternoon", "evening", "night"];

const MONTHS: [&str; 12] = [
    "january",
    "february",
    "march",
    "april",
    "may",
    "june",
    "july",
    "august",
    "september",
    "october",
    "november",
    "december",
];

/// A day of the month at `tokens[i]`: "15", "15th", "fifteenth",
/// "twenty first"; with how many tokens it spans.
fn day_of_month_at(tokens: &[&str], i: usize) -> Option<(i8, usize)> {
    if let Some((n, len)) = super::english::ordinal_at(tokens, i) {
        return (1..=31).contains(&n).then_some((n as i8, len));
    }
    day_of_month(tokens.get(i)?).map(|d| (d, 1))
}

fn day_of_month(tok: &str) -> Option<i8> {
    let digits = tok
        .trim_end_matches("st")
        .trim_end_matches("nd")
        .trim_end_matches("rd")
        .trim_end_matches("th");
    let n: i8 = digits.parse().ok()?;
    (1..=31).contains(&n).then_some(n)
}

fn month(tok: &str) -> Option<i8> {
    MONTHS
        .iter()
        .position(|m| {
            *m == tok || (tok.len() >= 3 && m.starts_with(tok) && tok != "mar" && tok != "may")
        })
        .map(|i| i as i8 + 1)
}

/// Finds days in normalised tokens, relative to `today`. A bare weekday
/// means the next such day, today included, or, in a question about the
/// past (`past`), the last such day: "who won on Friday" on a Saturday is
/// yesterday.
pub fn find_days(tokens: &[&str], today: Date, past: bool) -> Vec<DayMention> {
    let mut out = Vec::new();
    let mut i = 0;
    let month_at = |k: usize| tokens.get(k).and_then(|n| month(n));
    while i < tokens.len() {
        let t = tokens[i];
        let found = match t {
            "today" | "tonight" => Some((i + 1, today)),
            // "last night" is the evening before; "this morning" today.
            "last" if tokens.get(i + 1) == Some(&"night") => {
                today.yesterday().ok().map(|d| (i + 2, d))
            }
            "this" if tokens.get(i + 1).is_some_and(|t| PARTS_OF_DAY.contains(t)) => {
                Some((i + 2, today))
            }
            "tomorrow" => today.tomorrow().ok().map(|d| (i + 1, d)),
            "yesterday" => today.yesterday().ok().map(|d| (i + 1, d)),
            _ => {
                if let Some((_, wd)) = WEEKDAYS.iter().find(|(n, _)| *n == t) {
                    let mut ahead = (wd.to_monday_zero_offset()
                        - today.weekday().to_monday_zero_offset())
                    .rem_euclid(7);
                    if past && ahead > 0 {
                        ahead -= 7;
                    }
                    today
                        .checked_add(jiff::Span::new().days(ahead as i64))
                        .ok()
                        .map(|d| (i + 1, d))
                } else if let Ok(d) = t.parse::<Date>() {
                    Some((i + 1, d))
                } else if let Some((d, len)) = day_of_month_at(tokens, i) {
                    // "15 August", "the 15th of August", "fifteenth august".
                    let of = usize::from(tokens.get(i + len) == Some(&"of"));
                    if let Some(m) = month_at(i + len + of) {
                        Date::new(today.year(), m, d)
                            .ok()
                            .map(|date| (i + len + of + 1, date))
                    } else if i > 0
                        && tokens[i - 1] == "the"
                        && if t.starts_with(|c: char| c.is_ascii_digit()) {
                            !t.chars().all(|c| c.is_ascii_digit())
                        } else {
                            // A word ("the fifteenth") only when nothing
                            // else follows or "on" precedes: "the second
                            // heat" is a round.
                            i + len == tokens.len() || (i >= 2 && tokens[i - 2] == "on")
                        }
                    {
                        // "on the 18th", "the fifteenth": this month.
                        Date::new(today.year(), today.month(), d)
                            .ok()
                            .map(|date| (i + len, date))
                    } else {
                        None
                    }
                } else if let (Some(m), Some((d, len))) = (month(t), day_of_month_at(tokens, i + 1))
                {
                    // "August 15", "august the fifteenth".
                    Date::new(today.year(), m, d)
                        .ok()
                        .map(|date| (i + 1 + len, date))
                } else if let (Some(m), true, Some((d, len))) = (
                    month(t),
                    tokens.get(i + 1) == Some(&"the"),
                    day_of_month_at(tokens, i + 2),
                ) {
                    Date::new(today.year(), m, d)
                        .ok()
                        .map(|date| (i + 2 + len, date))
                } else {
                    None
                }
            }
        };
        match found {
            Some((mut end, date)) => {
                if tokens.get(end).is_some_and(|t| PARTS_OF_DAY.contains(t)) {
                    end += 1;
                }
                out.push(DayMention {
                    start: i,
                    end,
                    date,
                });
                i = end;
            }
            None => i += 1,
        }
    }
    out
}

/// A count such as "top five" or "top 3": (start, end, value).
pub fn find_count(tokens: &[&str]) -> Option<(usize, usize, u32)> {
    for i in 0..tokens.len().saturating_sub(1) {
        if matches!(tokens[i], "top" | "first" | "leading") {
            let next = tokens[i + 1];
            let n = next
                .parse::<u32>()
                .ok()
                .or_else(|| {
                    crate::answers::words::UNITS
                        .iter()
                        .position(|w| *w == next)
                        .map(|p| p as u32)
                })
                .or_else(|| (next == "twenty").then_some(20));
            // A table is never longer than 20 rows; "top 400" is an event.
            if let Some(n) = n.filter(|&n| (1..=20).contains(&n)) {
                return Some((i, i + 2, n));
            }
        }
    }
    None
}

#[cfg(test)]
mod tests {
    use super::*;
    use jiff::civil::date;

    #[test]
    fn relative_days() {
        // 2027-08-14 is a Saturday.
        let today = date(2027, 8, 14);
        let f = |s: &str| {
            find_days(&s.split(' ').collect::<Vec<_>>(), today, s.contains("won"))
                .first()
                .map(|m| m.date)
        };
        assert_eq!(f("whats on today"), Some(today));
        assert_eq!(f("who won last night"), Some(date(2027, 8, 13)));
        assert_eq!(f("what was on this morning"), Some(today));
        // A part of the day stays part of the day it follows.
        let toks: Vec<&str> = "whats on tomorrow night".split(' ').collect();
        assert_eq!(find_days(&toks, today, false)[0].end, 4);
        // "last" alone is a place, not a day.
        assert_eq!(f("who came last"), None);
        assert_eq!(f("whats on tomorrow"), Some(date(2027, 8, 15)));
        assert_eq!(f("on saturday"), Some(today));
        assert_eq!(f("on monday"), Some(date(2027, 8, 16)));
        assert_eq!(f("on 16 august"), Some(date(2027, 8, 16)));
        assert_eq!(f("on august 16th"), Some(date(2027, 8, 16)));
        assert_eq!(f("on 2027-08-12"), Some(date(2027, 8, 12)));
        assert_eq!(f("whats on on the 18th"), Some(date(2027, 8, 18)));
        assert_eq!(f("who won"), None);
        assert_eq!(f("whats on the fifteenth"), Some(date(2027, 8, 15)));
        assert_eq!(f("on the 15th of august"), Some(date(2027, 8, 15)));
        assert_eq!(f("on august the fifteenth"), Some(date(2027, 8, 15)));
        assert_eq!(f("the twenty first of august"), Some(date(2027, 8, 21)));
        // In the past tense a weekday is the last one.
        assert_eq!(f("who won on friday"), Some(date(2027, 8, 13)));
        assert_eq!(f("who won on saturday"), Some(today));
        assert_eq!(f("whats on on friday"), Some(date(2027, 8, 20)));
        assert_eq!(f("who won the second heat"), None);
        // A count or a place is not a day.
        assert_eq!(f("top 5 in the 100 m"), None);
    }

    #[test]
    fn counts() {
        assert_eq!(find_count(&["top", "five"]), Some((0, 2, 5)));
        assert_eq!(find_count(&["show", "the", "top", "3"]), Some((2, 4, 3)));
        assert_eq!(find_count(&["top", "delegation"]), None);
    }
}
