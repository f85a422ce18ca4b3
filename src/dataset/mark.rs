//! Marks: the result an entry achieved, parsed from the data files and
//! written back out for chat and SMS or spoken for voice.
//!
//! A mark keeps how many decimals it was written with, because "9.80" and
//! "9.8" are different statements in a results table and must be repeated
//! faithfully. All arithmetic (margins, comparisons) is done in whole units
//! of the smallest written decimal so that no floating-point noise such as
//! "0.049999" can reach a reader.

use std::cmp::Ordering;
use std::fmt;

use crate::answers::words;
use crate::dataset::model::Measure;

/// Most decimals a mark may carry; results never need more, and the cap
/// keeps every mark exact in the integer arithmetic below.
const MAX_DECIMALS: u8 = 6;

/// Largest mark in whole units of its decimals. Below 2^50, a value divided
/// into an `f64` and multiplied back rounds to the same integer, so the
/// `value` field alone is enough to recover the mark exactly.
const MAX_UNITS: u64 = 1_000_000_000_000_000;

/// A parsed result: seconds for a time, metres for a distance, points or
/// votes, together with the number of decimals it was written with.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Mark {
    value: f64,
    decimals: u8,
}

impl Mark {
    /// The mark in seconds, metres, points or votes.
    pub fn value(&self) -> f64 {
        self.value
    }

    /// How many decimals the mark was written with ("9.80" → 2).
    pub fn decimals(&self) -> u8 {
        self.decimals
    }

    /// The mark in whole units of its last decimal ("9.80" → 980).
    pub fn units(&self) -> u64 {
        // Exact by construction: see `MAX_UNITS`.
        (self.value * pow10(self.decimals) as f64).round() as u64
    }

    /// A mark from whole units of its last decimal: `from_units(980, 2)` is
    /// 9.80. `None` if it has more than six decimals or is too large to keep
    /// exactly (a thousand million million units).
    pub fn from_units(units: u64, decimals: u8) -> Option<Mark> {
        if decimals > MAX_DECIMALS || units > MAX_UNITS {
            return None;
        }
        Some(Mark {
            value: units as f64 / pow10(decimals) as f64,
            decimals,
        })
    }
}

/// Why a mark could not be read.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum MarkError {
    /// Nothing was written.
    Empty {
        /// The measure that was expected.
        measure: Measure,
    },
    /// The text is not a mark of this measure.
    Malformed {
        /// The measure that was expected.
        measure: Measure,
        /// The text as given.
        text: String,
    },
    /// A minus sign: no measure here can be negative.
    Negative {
        /// The measure that was expected.
        measure: Measure,
        /// The text as given.
        text: String,
    },
    /// Minutes or seconds of 60 or more after the first field of a time.
    FieldOverflow {
        /// The text as given.
        text: String,
    },
    /// More than six decimals, or too large to keep exactly.
    TooLong {
        /// The measure that was expected.
        measure: Measure,
        /// The text as given.
        text: String,
    },
}

/// What a mark of this measure looks like, for error messages.
fn expectation(measure: Measure) -> &'static str {
    match measure {
        Measure::Time => "a time such as 10.12 or 1:59.32",
        Measure::Distance => "a distance in metres such as 8.21",
        Measure::Points => "points such as 14.533 or 87",
        Measure::Votes => "a whole number of votes such as 1234 or 1,234",
        Measure::Score => "a whole-number score such as 0 or 3",
    }
}

/// The measure's name in running text, for error messages.
fn noun(measure: Measure) -> &'static str {
    match measure {
        Measure::Time => "a time",
        Measure::Distance => "a distance",
        Measure::Points => "points",
        Measure::Votes => "votes",
        Measure::Score => "a score",
    }
}

impl fmt::Display for MarkError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            MarkError::Empty { measure } => {
                write!(f, "expected {}, got nothing", expectation(*measure))
            }
            MarkError::Malformed { measure, text } => {
                write!(f, "expected {}, got {text:?}", expectation(*measure))
            }
            MarkError::Negative { measure, text } => {
                write!(f, "{} cannot be negative, got {text:?}", noun(*measure))
            }
            MarkError::FieldOverflow { text } => write!(
                f,
                "minutes and seconds after the first field must be below 60, got {text:?}"
            ),
            MarkError::TooLong { measure, text } => write!(
                f,
                "{} may have at most {MAX_DECIMALS} decimals and \
                 {} significant digits, got {text:?}",
                noun(*measure),
                MAX_UNITS.ilog10()
            ),
        }
    }
}

impl std::error::Error for MarkError {}

/// 10 to the power `d`; `d` never exceeds [`MAX_DECIMALS`], far from
/// overflow.
fn pow10(d: u8) -> u64 {
    10u64.pow(u32::from(d))
}

/// Parses a mark as written in the data files.
///
/// - Time: seconds ("10.12", "59.9"), m:ss ("1:05", "1:59.32") or h:mm:ss
///   ("2:05:31", "2:05:31.4"). Fields after the first have exactly two
///   digits and must be below 60. A trailing "s" unit ("10.12 s") is
///   allowed so that chat output reads back in.
/// - Distance: metres as a decimal ("8.21", "72.5"), optionally with "m".
/// - Points: a decimal as written ("14.533", "87", "0").
/// - Votes: a whole number, plain or with comma thousands ("1234", "1,234").
///
/// Surrounding whitespace is ignored. Decimals need a digit on both sides
/// of the point ("0.5", not ".5" or "5."), so typos are caught rather than
/// guessed at. At most six decimals are kept.
pub fn parse(measure: Measure, text: &str) -> Result<Mark, MarkError> {
    let trimmed = text.trim();
    if trimmed.is_empty() {
        return Err(MarkError::Empty { measure });
    }
    let malformed = || MarkError::Malformed {
        measure,
        text: text.to_string(),
    };
    let too_long = || MarkError::TooLong {
        measure,
        text: text.to_string(),
    };
    if trimmed.starts_with('-') {
        return Err(MarkError::Negative {
            measure,
            text: text.to_string(),
        });
    }
    // Number text without a unit, which only times and distances carry.
    let body = match measure {
        Measure::Time => strip_unit(trimmed, "s"),
        Measure::Distance => strip_unit(trimmed, "m"),
        Measure::Points | Measure::Votes | Measure::Score => trimmed,
    };
    let (units, decimals) = match measure {
        Measure::Time => {
            let fields: Vec<&str> = body.split(':').collect();
            let (last, leading) = fields.split_last().ok_or_else(malformed)?;
            if leading.len() > 2 {
                return Err(malformed());
            }
            let (secs, decimals) = decimal_units(last).ok_or_else(malformed)?;
            let d = decimals.ok_or_else(too_long)?;
            let overflow = || MarkError::FieldOverflow {
                text: text.to_string(),
            };
            match leading.split_first() {
                // Plain seconds: any size, like "59.9" or "125.3".
                None => (secs, d),
                Some((first, middle)) => {
                    // After a colon, seconds are written with two digits.
                    if last.split('.').next().map(str::len) != Some(2) {
                        return Err(malformed());
                    }
                    if secs / pow10(d) >= 60 {
                        return Err(overflow());
                    }
                    let mut minutes = digits(first).ok_or_else(malformed)?;
                    for field in middle {
                        let m = two_digits(field).ok_or_else(malformed)?;
                        if m >= 60 {
                            return Err(overflow());
                        }
                        minutes = minutes
                            .checked_mul(60)
                            .and_then(|x| x.checked_add(m))
                            .ok_or_else(too_long)?;
                    }
                    let units = minutes
                        .checked_mul(60 * pow10(d))
                        .and_then(|x| x.checked_add(secs))
                        .ok_or_else(too_long)?;
                    (units, d)
                }
            }
        }
        Measure::Distance | Measure::Points => {
            let (units, decimals) = decimal_units(body).ok_or_else(malformed)?;
            (units, decimals.ok_or_else(too_long)?)
        }
        Measure::Votes => (vote_count(body).ok_or_else(malformed)?, 0),
        // A side's score is a plain whole number: "3", never "3.0".
        Measure::Score => (digits(body).ok_or_else(malformed)?, 0),
    };
    Mark::from_units(units, decimals).ok_or_else(too_long)
}

/// The text without a trailing unit symbol, with or without a space before
/// it ("10.12 s", "10.12s").
fn strip_unit<'a>(text: &'a str, unit: &str) -> &'a str {
    text.strip_suffix(unit).map_or(text, str::trim_end)
}

/// A non-empty run of ASCII digits as a number.
fn digits(text: &str) -> Option<u64> {
    if text.is_empty() || !text.bytes().all(|b| b.is_ascii_digit()) {
        return None;
    }
    // Too many digits for u64 is also "too long", caught by MAX_UNITS later;
    // saturate so the caller reports that rather than a format error.
    Some(text.parse().unwrap_or(u64::MAX))
}

/// Exactly two ASCII digits, as in the minutes of "2:05:31".
fn two_digits(text: &str) -> Option<u64> {
    (text.len() == 2).then(|| digits(text)).flatten()
}

/// "14.533" → (14533, Some(3)); "87" → (87, Some(0)). The decimals are
/// `None` when there are too many to keep, so the caller can say why.
fn decimal_units(text: &str) -> Option<(u64, Option<u8>)> {
    let (whole, frac) = match text.split_once('.') {
        Some((w, f)) => (w, f),
        None => (text, ""),
    };
    let whole_n = digits(whole)?;
    if text.contains('.') && digits(frac).is_none() {
        return None;
    }
    let d = u8::try_from(frac.len()).ok().filter(|d| *d <= MAX_DECIMALS);
    let Some(d) = d else {
        return Some((0, None));
    };
    let frac_n = if frac.is_empty() { 0 } else { digits(frac)? };
    let units = whole_n
        .checked_mul(pow10(d))
        .and_then(|w| w.checked_add(frac_n))
        .unwrap_or(u64::MAX);
    Some((units, Some(d)))
}

/// A vote count: plain digits, or groups of three after a first group of
/// one to three digits, separated by commas ("1,234,567").
fn vote_count(text: &str) -> Option<u64> {
    if !text.contains(',') {
        return digits(text);
    }
    let mut groups = text.split(',');
    let first = groups.next()?;
    // A leading zero group ("0,123") is a typo, not a count.
    if first.is_empty() || first.len() > 3 || first.starts_with('0') {
        return None;
    }
    let mut n = digits(first)?;
    for g in groups {
        if g.len() != 3 {
            return None;
        }
        n = n.checked_mul(1000)?.checked_add(digits(g)?)?;
    }
    Some(n)
}

/// Whole and fractional parts of a mark in its own units.
fn split(units: u64, decimals: u8) -> (u64, u64) {
    let scale = pow10(decimals);
    (units / scale, units % scale)
}

/// A non-negative decimal written with exactly `decimals` decimals.
fn decimal_text(whole: u64, frac: u64, decimals: u8) -> String {
    if decimals == 0 {
        whole.to_string()
    } else {
        format!("{whole}.{frac:0width$}", width = usize::from(decimals))
    }
}

/// Formats a time given in units of its last decimal for chat and SMS.
fn time_text(units: u64, decimals: u8) -> String {
    let (secs, frac) = split(units, decimals);
    if secs < 60 {
        return format!("{} s", decimal_text(secs, frac, decimals));
    }
    let (h, m, s) = (secs / 3600, secs / 60 % 60, secs % 60);
    // Seconds after a colon always have two digits: "1:05.2".
    let sec = format!(
        "{:0>width$}",
        decimal_text(s, frac, decimals),
        width = sec_width(decimals)
    );
    if h == 0 {
        format!("{m}:{sec}")
    } else {
        format!("{h}:{m:02}:{sec}")
    }
}

/// Width of a zero-padded seconds field: two digits, a point, the decimals.
fn sec_width(decimals: u8) -> usize {
    if decimals == 0 {
        2
    } else {
        3 + usize::from(decimals)
    }
}

/// Formats a mark for chat and SMS: a time under a minute as "10.12 s",
/// under an hour as "1:59.32", longer as "2:05:31" (written decimals are
/// kept); a distance as "8.21 m"; points as written ("14.533"); votes with
/// thousands separators and the unit ("1,234 votes"), as a figure without
/// its unit reads like a score.
pub fn format_text(measure: Measure, mark: &Mark) -> String {
    let (units, d) = (mark.units(), mark.decimals);
    match measure {
        Measure::Time => time_text(units, d),
        Measure::Distance => {
            let (w, f) = split(units, d);
            format!("{} m", decimal_text(w, f, d))
        }
        Measure::Points => {
            let (w, f) = split(units, d);
            decimal_text(w, f, d)
        }
        Measure::Votes => {
            // Votes are whole, but a mark built with decimals still prints
            // its whole part with separators rather than a fraction of a vote.
            let (w, _) = split(units, d);
            words::count_noun(w, "vote", None, words::NumberStyle::Figures)
        }
        // One side's score on its own is a bare figure; the two sides
        // together read "3–2" (`dataset::sides`).
        Measure::Score => split(units, d).0.to_string(),
    }
}

/// A quantity in words with its unit, singular only for exactly one with
/// no decimals ("one second", but "one point zero seconds").
fn spoken_quantity(whole: u64, frac: u64, decimals: u8, singular: &str, plural: &str) -> String {
    let number = words::decimal_words(&decimal_text(whole, frac, decimals));
    let unit = if whole == 1 && decimals == 0 {
        singular
    } else {
        plural
    };
    format!("{number} {unit}")
}

/// Says a time given in units of its last decimal.
fn time_spoken(units: u64, decimals: u8) -> String {
    let (secs, frac) = split(units, decimals);
    if secs < 60 {
        return spoken_quantity(secs, frac, decimals, "second", "seconds");
    }
    let (h, m, s) = (secs / 3600, secs / 60 % 60, secs % 60);
    let seconds =
        (s > 0 || frac > 0).then(|| spoken_quantity(s, frac, decimals, "second", "seconds"));
    if h == 0 {
        // Announcers run minutes and seconds together: "one minute
        // fifty-nine point three two seconds".
        let minutes = words::count_noun(m, "minute", None, words::NumberStyle::Words);
        return match seconds {
            Some(s) => format!("{minutes} {s}"),
            None => minutes,
        };
    }
    // Longer times are listed: "two hours, five minutes and thirty-one
    // seconds", leaving out parts that are zero.
    let mut parts = vec![words::count_noun(
        h,
        "hour",
        None,
        words::NumberStyle::Words,
    )];
    if m > 0 {
        parts.push(words::count_noun(
            m,
            "minute",
            None,
            words::NumberStyle::Words,
        ));
    }
    parts.extend(seconds);
    words::join_list(&parts, "and")
}

/// Says a mark for voice, in words only: "ten point one two seconds", "one
/// minute fifty-nine point three two seconds", "two hours, five minutes and
/// thirty-one seconds", "two hours and five minutes", "one hour";
/// "eight point two one metres"; "fourteen point five three three points",
/// "eighty-seven points", "one point"; "one thousand, two hundred and
/// thirty-four votes", "one vote".
pub fn format_spoken(measure: Measure, mark: &Mark) -> String {
    let (units, d) = (mark.units(), mark.decimals);
    let (w, f) = split(units, d);
    match measure {
        Measure::Time => time_spoken(units, d),
        Measure::Distance => spoken_quantity(w, f, d, "metre", "metres"),
        Measure::Points => spoken_quantity(w, f, d, "point", "points"),
        Measure::Votes => words::count_noun(w, "vote", None, words::NumberStyle::Words),
        Measure::Score => words::cardinal(w),
    }
}

/// Both marks in units of the larger of their decimal counts. `u128`
/// because a large mark with few decimals scaled to six decimals can pass
/// `u64` (10^15 units times 10^6).
fn common_units(a: &Mark, b: &Mark) -> (u128, u128, u8) {
    let d = a.decimals.max(b.decimals);
    let scale = |m: &Mark| u128::from(m.units()) * u128::from(pow10(d - m.decimals));
    (scale(a), scale(b), d)
}

/// The margin between two marks in units of its decimals, exact.
fn margin(a: &Mark, b: &Mark) -> (u64, u8) {
    let (ua, ub, d) = common_units(a, b);
    // Only a margin between marks of wildly different size and precision
    // can pass u64; no result gets there, so saturating is enough.
    (u64::try_from(ua.abs_diff(ub)).unwrap_or(u64::MAX), d)
}

/// The margin between two marks for chat and SMS, written with the larger
/// of their decimal counts: "0.05 s" (or "1:02.30" from a minute up),
/// "0.12 m", "3" points, "1,204 votes".
pub fn format_margin_text(measure: Measure, a: &Mark, b: &Mark) -> String {
    let (units, d) = margin(a, b);
    match measure {
        Measure::Time => time_text(units, d),
        Measure::Distance => {
            let (w, f) = split(units, d);
            format!("{} m", decimal_text(w, f, d))
        }
        Measure::Points => {
            let (w, f) = split(units, d);
            decimal_text(w, f, d)
        }
        Measure::Votes => {
            words::count_noun(split(units, d).0, "vote", None, words::NumberStyle::Figures)
        }
        Measure::Score => split(units, d).0.to_string(),
    }
}

/// The margin between two marks for voice: "zero point zero five seconds",
/// "zero point one two metres", "three points", "one thousand, two hundred
/// and four votes".
pub fn format_margin_spoken(measure: Measure, a: &Mark, b: &Mark) -> String {
    let (units, d) = margin(a, b);
    let (w, f) = split(units, d);
    match measure {
        Measure::Time => time_spoken(units, d),
        Measure::Distance => spoken_quantity(w, f, d, "metre", "metres"),
        Measure::Points => spoken_quantity(w, f, d, "point", "points"),
        Measure::Votes => words::count_noun(w, "vote", None, words::NumberStyle::Words),
        Measure::Score => words::cardinal(w),
    }
}

/// Which of two marks is better: `Less` when `a` is better, `Equal` when
/// they are the same result ("9.8" equals "9.80"), `Greater` when `b` is.
/// `better_lower` is true for times and false for distances, points and
/// votes, unless a contest says otherwise.
pub fn compare(better_lower: bool, a: &Mark, b: &Mark) -> Ordering {
    // Compared in integer units, so equal results written alike never
    // differ by float noise.
    let (ua, ub, _) = common_units(a, b);
    if better_lower {
        ua.cmp(&ub)
    } else {
        ub.cmp(&ua)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    fn p(measure: Measure, text: &str) -> Mark {
        parse(measure, text).unwrap_or_else(|e| panic!("parse {text:?}: {e}"))
    }

    fn text(measure: Measure, s: &str) -> String {
        format_text(measure, &p(measure, s))
    }

    fn spoken(measure: Measure, s: &str) -> String {
        format_spoken(measure, &p(measure, s))
    }

    #[test]
    fn parses_times() {
        let cases = [
            ("10.12", 10.12, 2),
            ("59.9", 59.9, 1),
            ("1:59.32", 119.32, 2),
            ("2:05:31", 7531.0, 0),
            ("2:05:31.4", 7531.4, 1),
            ("1:05", 65.0, 0),
            ("125.3", 125.3, 1),
            (" 10.12 s", 10.12, 2),
            ("10.12s", 10.12, 2),
            ("0:59.00", 59.0, 2),
        ];
        for (s, value, decimals) in cases {
            let m = p(Measure::Time, s);
            assert_eq!(m.value(), value, "{s}");
            assert_eq!(m.decimals(), decimals, "{s}");
        }
    }

    #[test]
    fn rejects_bad_times() {
        use MarkError::*;
        let t = Measure::Time;
        assert_eq!(parse(t, ""), Err(Empty { measure: t }));
        assert_eq!(parse(t, "   "), Err(Empty { measure: t }));
        for bad in ["1:60", "1:60.00", "2:60:00", "2:05:60", "1:75.3"] {
            assert!(
                matches!(parse(t, bad), Err(FieldOverflow { .. })),
                "{bad}: {:?}",
                parse(t, bad)
            );
        }
        for bad in ["-10.12", "-1:05"] {
            assert!(matches!(parse(t, bad), Err(Negative { .. })), "{bad}");
        }
        for bad in [
            "abc", "10.12x", "1:5", "1:5.2", "1::05", ":05", "1:2:3:04", "10.", ".5", "1:05:",
            "1,05", "10 .12", "1:059",
        ] {
            assert!(
                matches!(parse(t, bad), Err(Malformed { .. })),
                "{bad}: {:?}",
                parse(t, bad)
            );
        }
        assert!(matches!(parse(t, "1.1234567"), Err(TooLong { .. })));
        assert!(matches!(
            parse(t, "99999999999999999999999"),
            Err(TooLong { .. })
        ));
    }

    #[test]
    fn error_messages_are_lowercase_and_quote_the_input() {
        let e = parse(Measure::Time, "abc").unwrap_err();
        assert_eq!(
            e.to_string(),
            "expected a time such as 10.12 or 1:59.32, got \"abc\""
        );
        assert_eq!(
            parse(Measure::Distance, "").unwrap_err().to_string(),
            "expected a distance in metres such as 8.21, got nothing"
        );
        assert_eq!(
            parse(Measure::Votes, "12.5").unwrap_err().to_string(),
            "expected a whole number of votes such as 1234 or 1,234, got \"12.5\""
        );
        assert_eq!(
            parse(Measure::Time, "-1").unwrap_err().to_string(),
            "a time cannot be negative, got \"-1\""
        );
        assert_eq!(
            parse(Measure::Time, "1:60").unwrap_err().to_string(),
            "minutes and seconds after the first field must be below 60, got \"1:60\""
        );
        assert_eq!(
            parse(Measure::Points, "1.1234567").unwrap_err().to_string(),
            "points may have at most 6 decimals and 15 significant digits, got \"1.1234567\""
        );
    }

    #[test]
    fn parses_distances_points_and_votes() {
        assert_eq!(p(Measure::Distance, "8.21").value(), 8.21);
        assert_eq!(p(Measure::Distance, "72.5").value(), 72.5);
        assert_eq!(p(Measure::Distance, "8.21 m").value(), 8.21);
        assert_eq!(p(Measure::Points, "14.533").value(), 14.533);
        assert_eq!(p(Measure::Points, "14.533").decimals(), 3);
        assert_eq!(p(Measure::Points, "87").value(), 87.0);
        assert_eq!(p(Measure::Points, "0").value(), 0.0);
        assert_eq!(p(Measure::Votes, "1234").value(), 1234.0);
        assert_eq!(p(Measure::Votes, "1,234").value(), 1234.0);
        assert_eq!(p(Measure::Votes, "1,234,567").value(), 1_234_567.0);
        assert_eq!(p(Measure::Votes, "0").value(), 0.0);
        for bad in ["-3", "8,21", "abc", "8.21 s", "1:05", ""] {
            assert!(parse(Measure::Distance, bad).is_err(), "distance {bad}");
        }
        for bad in ["-3", "14.5 m", "x"] {
            assert!(parse(Measure::Points, bad).is_err(), "points {bad}");
        }
        for bad in [
            "12.5", "12,34", "1,2345", ",123", "0,123", "1,,234", "-5", "1 234", "1e3",
        ] {
            assert!(parse(Measure::Votes, bad).is_err(), "votes {bad}");
        }
    }

    #[test]
    fn formats_text() {
        assert_eq!(text(Measure::Time, "10.12"), "10.12 s");
        assert_eq!(text(Measure::Time, "59.9"), "59.9 s");
        assert_eq!(text(Measure::Time, "1:59.32"), "1:59.32");
        assert_eq!(text(Measure::Time, "1:05"), "1:05");
        assert_eq!(text(Measure::Time, "1:05.2"), "1:05.2");
        assert_eq!(text(Measure::Time, "125.3"), "2:05.3");
        assert_eq!(text(Measure::Time, "2:05:31"), "2:05:31");
        assert_eq!(text(Measure::Time, "2:05:31.4"), "2:05:31.4");
        assert_eq!(text(Measure::Time, "9.80"), "9.80 s");
        assert_eq!(text(Measure::Distance, "8.21"), "8.21 m");
        assert_eq!(text(Measure::Distance, "72.5"), "72.5 m");
        assert_eq!(text(Measure::Points, "14.533"), "14.533");
        assert_eq!(text(Measure::Points, "87"), "87");
        assert_eq!(text(Measure::Points, "0"), "0");
        assert_eq!(text(Measure::Votes, "1234"), "1,234 votes");
        assert_eq!(text(Measure::Votes, "1,234"), "1,234 votes");
        assert_eq!(text(Measure::Votes, "999"), "999 votes");
        assert_eq!(text(Measure::Votes, "1"), "1 vote");
    }

    #[test]
    fn formats_spoken() {
        let t = Measure::Time;
        assert_eq!(spoken(t, "10.12"), "ten point one two seconds");
        assert_eq!(
            spoken(t, "1:59.32"),
            "one minute fifty-nine point three two seconds"
        );
        assert_eq!(
            spoken(t, "2:05:31"),
            "two hours, five minutes and thirty-one seconds"
        );
        assert_eq!(
            spoken(t, "2:05:31.4"),
            "two hours, five minutes and thirty-one point four seconds"
        );
        assert_eq!(spoken(t, "2:05:00"), "two hours and five minutes");
        assert_eq!(spoken(t, "1:00:00"), "one hour");
        assert_eq!(spoken(t, "1:00:01"), "one hour and one second");
        assert_eq!(spoken(t, "2:00:31"), "two hours and thirty-one seconds");
        assert_eq!(spoken(t, "1:05"), "one minute five seconds");
        assert_eq!(spoken(t, "2:00"), "two minutes");
        assert_eq!(spoken(t, "1"), "one second");
        assert_eq!(spoken(t, "1.0"), "one point zero seconds");
        assert_eq!(
            spoken(Measure::Distance, "8.21"),
            "eight point two one metres"
        );
        assert_eq!(spoken(Measure::Distance, "1"), "one metre");
        assert_eq!(
            spoken(Measure::Points, "14.533"),
            "fourteen point five three three points"
        );
        assert_eq!(spoken(Measure::Points, "87"), "eighty-seven points");
        assert_eq!(spoken(Measure::Points, "1"), "one point");
        assert_eq!(spoken(Measure::Points, "0"), "zero points");
        assert_eq!(
            spoken(Measure::Votes, "1234"),
            "one thousand, two hundred and thirty-four votes"
        );
        assert_eq!(spoken(Measure::Votes, "1"), "one vote");
    }

    #[test]
    fn formats_margins() {
        let m = |measure, a, b| {
            let (a, b) = (p(measure, a), p(measure, b));
            (
                format_margin_text(measure, &a, &b),
                format_margin_spoken(measure, &a, &b),
            )
        };
        assert_eq!(
            m(Measure::Time, "10.12", "10.17"),
            ("0.05 s".into(), "zero point zero five seconds".into())
        );
        // Symmetric, and decimals follow the more precise mark.
        assert_eq!(
            m(Measure::Time, "10.2", "10.15"),
            ("0.05 s".into(), "zero point zero five seconds".into())
        );
        assert_eq!(
            m(Measure::Time, "2:05:31.4", "2:04:29.10"),
            (
                "1:02.30".into(),
                "one minute two point three zero seconds".into()
            )
        );
        assert_eq!(
            m(Measure::Distance, "8.21", "8.09"),
            ("0.12 m".into(), "zero point one two metres".into())
        );
        assert_eq!(
            m(Measure::Points, "87", "84"),
            ("3".into(), "three points".into())
        );
        assert_eq!(
            m(Measure::Points, "14.533", "14.5"),
            ("0.033".into(), "zero point zero three three points".into())
        );
        assert_eq!(
            m(Measure::Votes, "1,234", "30"),
            (
                "1,204 votes".into(),
                "one thousand, two hundred and four votes".into()
            )
        );
        assert_eq!(
            m(Measure::Votes, "31", "30"),
            ("1 vote".into(), "one vote".into())
        );
        // The classic float trap: 0.3 - 0.1 must not print 0.19999.
        assert_eq!(m(Measure::Distance, "0.3", "0.1").0, "0.2 m");
    }

    #[test]
    fn compares_marks() {
        let t = |s| p(Measure::Time, s);
        assert_eq!(compare(true, &t("9.58"), &t("9.63")), Ordering::Less);
        assert_eq!(compare(true, &t("9.63"), &t("9.58")), Ordering::Greater);
        assert_eq!(compare(true, &t("9.8"), &t("9.80")), Ordering::Equal);
        assert_eq!(compare(true, &t("59.99"), &t("1:00.00")), Ordering::Less);
        let d = |s| p(Measure::Distance, s);
        assert_eq!(compare(false, &d("8.21"), &d("8.09")), Ordering::Less);
        assert_eq!(compare(false, &d("8.09"), &d("8.21")), Ordering::Greater);
        assert_eq!(compare(false, &d("8.1"), &d("8.10")), Ordering::Equal);
    }

    #[test]
    fn from_units_round_trips_and_bounds() {
        let m = Mark::from_units(980, 2).unwrap();
        assert_eq!((m.value(), m.decimals(), m.units()), (9.8, 2, 980));
        assert!(Mark::from_units(1, 7).is_none());
        assert!(Mark::from_units(MAX_UNITS + 1, 0).is_none());
        let big = Mark::from_units(MAX_UNITS, 6).unwrap();
        assert_eq!(big.units(), MAX_UNITS);
    }

    proptest! {
        #[test]
        fn time_text_round_trips(hundredths in 0u64..100 * 3600 * 30, decimals in 0u8..=2) {
            // Marks written with 0, 1 or 2 decimals, from whole hundredths.
            let units = hundredths / pow10(2 - decimals);
            let m = Mark::from_units(units, decimals).unwrap();
            let once = format_text(Measure::Time, &m);
            let back = parse(Measure::Time, &once).unwrap();
            prop_assert_eq!(back.units(), units);
            prop_assert_eq!(back.decimals(), decimals);
            prop_assert_eq!(format_text(Measure::Time, &back), once);
        }

        #[test]
        fn distance_text_round_trips(hundredths in 0u64..10_000_000, decimals in 0u8..=2) {
            let units = hundredths / pow10(2 - decimals);
            let m = Mark::from_units(units, decimals).unwrap();
            let once = format_text(Measure::Distance, &m);
            let back = parse(Measure::Distance, &once).unwrap();
            prop_assert_eq!(back.units(), units);
            prop_assert_eq!(format_text(Measure::Distance, &back), once);
        }

        #[test]
        fn margins_are_symmetric_and_exact(a in 0u64..1_000_000, b in 0u64..1_000_000) {
            let (ma, mb) = (Mark::from_units(a, 2).unwrap(), Mark::from_units(b, 2).unwrap());
            let want = Mark::from_units(a.abs_diff(b), 2).unwrap();
            prop_assert_eq!(
                format_margin_text(Measure::Time, &ma, &mb),
                format_text(Measure::Time, &want)
            );
            prop_assert_eq!(
                format_margin_text(Measure::Time, &mb, &ma),
                format_text(Measure::Time, &want)
            );
        }
    }
}
