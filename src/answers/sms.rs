//! How long a reply is as one SMS: which encoding it would be sent in (GSM
//! 7-bit or UCS-2), how many units it takes and whether it fits one segment.
//!
//! An SMS carries 140 octets of user data (3GPP TS 23.040 §9.2.3.24). A text
//! whose every character is in the GSM 7-bit default alphabet or its
//! extension table (3GPP TS 23.038 §6.2.1, §6.2.1.1) is packed as septets, so
//! 160 fit; any other character forces the whole message into UCS-2
//! (TS 23.038 §6.2.3), two octets a unit, so 70 fit. A longer text is split
//! into several segments that each lose room to a user-data header, cost more
//! and may arrive out of order, so the SMS channel measures a reply before
//! sending it. These are single-segment limits, with no user-data header.
//!
//! The two tables are written out below exactly as the standard lists them;
//! a unit test checks them, character by character over the whole Basic
//! Multilingual Plane, against an independent codec (the `gsm0338` package
//! from PyPI, see `tests/fixtures/gsm0338_alphabet.tsv`).

/// How a text would be sent in one SMS.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Encoding {
    /// The GSM 7-bit default alphabet with its extension table
    /// (3GPP TS 23.038 §6.2.1): 160 septets in one segment.
    Gsm7,
    /// UCS-2, needed as soon as one character is outside the GSM 7-bit
    /// tables (3GPP TS 23.038 §6.2.3): 70 UTF-16 code units in one segment.
    Ucs2,
}

/// The size of a text as one SMS, in the units of the encoding it needs.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
pub struct Measure {
    /// The encoding the text would be sent in: GSM 7-bit when every
    /// character allows it, UCS-2 otherwise.
    pub encoding: Encoding,
    /// Septets for GSM 7-bit (extension-table characters count 2), UTF-16
    /// code units for UCS-2.
    pub units: usize,
    /// 160 for GSM 7-bit, 70 for UCS-2.
    pub limit: usize,
}

impl Measure {
    /// Whether the text goes out as a single segment, so the reader gets it
    /// whole, in one message, at the price of one.
    pub fn fits_one_segment(&self) -> bool {
        self.units <= self.limit
    }
}

/// Septets in one segment: 140 octets of user data × 8 / 7 bits
/// (3GPP TS 23.040 §9.2.3.24, no user-data header).
const GSM7_LIMIT: usize = 160;

/// UTF-16 code units in one segment: 140 octets / 2 octets a unit
/// (3GPP TS 23.040 §9.2.3.24, no user-data header).
const UCS2_LIMIT: usize = 70;

/// The GSM 7-bit default alphabet, 3GPP TS 23.038 §6.2.1, indexed by septet
/// value. Position 0x1B is the escape to the extension table, not a
/// character, hence `None`. Beware the positions where it differs from
/// ASCII: 0x00 '@', 0x02 '$', 0x11 '_', 0x24 '¤', 0x40 '¡', 0x60 '¿', and
/// 0x5B..0x5E, 0x7B..0x7F hold letters where ASCII has brackets.
const DEFAULT_ALPHABET: [Option<char>; 128] = [
    Some('@'),  // 0x00 COMMERCIAL AT
    Some('£'),  // 0x01 POUND SIGN
    Some('$'),  // 0x02 DOLLAR SIGN
    Some('¥'),  // 0x03 YEN SIGN
    Some('è'),  // 0x04 LATIN SMALL LETTER E WITH GRAVE
    Some('é'),  // 0x05 LATIN SMALL LETTER E WITH ACUTE
    Some('ù'),  // 0x06 LATIN SMALL LETTER U WITH GRAVE
    Some('ì'),  // 0x07 LATIN SMALL LETTER I WITH GRAVE
    Some('ò'),  // 0x08 LATIN SMALL LETTER O WITH GRAVE
    Some('Ç'), // 0x09 LATIN CAPITAL LETTER C WITH CEDILLA (the standard's glyph; see the fixture test)
    Some('\n'), // 0x0A LINE FEED
    Some('Ø'), // 0x0B LATIN CAPITAL LETTER O WITH STROKE
    Some('ø'), // 0x0C LATIN SMALL LETTER O WITH STROKE
    Some('\r'), // 0x0D CARRIAGE RETURN
    Some('Å'), // 0x0E LATIN CAPITAL LETTER A WITH RING ABOVE
    Some('å'), // 0x0F LATIN SMALL LETTER A WITH RING ABOVE
    Some('Δ'), // 0x10 GREEK CAPITAL LETTER DELTA
    Some('_'), // 0x11 LOW LINE
    Some('Φ'), // 0x12 GREEK CAPITAL LETTER PHI
    Some('Γ'), // 0x13 GREEK CAPITAL LETTER GAMMA
    Some('Λ'), // 0x14 GREEK CAPITAL LETTER LAMDA
    Some('Ω'), // 0x15 GREEK CAPITAL LETTER OMEGA
    Some('Π'), // 0x16 GREEK CAPITAL LETTER PI
    Some('Ψ'), // 0x17 GREEK CAPITAL LETTER PSI
    Some('Σ'), // 0x18 GREEK CAPITAL LETTER SIGMA
    Some('Θ'), // 0x19 GREEK CAPITAL LETTER THETA
    Some('Ξ'), // 0x1A GREEK CAPITAL LETTER XI
    None,      // 0x1B ESCAPE TO EXTENSION TABLE
    Some('Æ'), // 0x1C LATIN CAPITAL LETTER AE
    Some('æ'), // 0x1D LATIN SMALL LETTER AE
    Some('ß'), // 0x1E LATIN SMALL LETTER SHARP S
    Some('É'), // 0x1F LATIN CAPITAL LETTER E WITH ACUTE
    Some(' '), // 0x20 SPACE
    Some('!'), // 0x21 EXCLAMATION MARK
    Some('"'), // 0x22 QUOTATION MARK
    Some('#'), // 0x23 NUMBER SIGN
    Some('¤'), // 0x24 CURRENCY SIGN (not '$', which is 0x02)
    Some('%'), // 0x25 PERCENT SIGN
    Some('&'), // 0x26 AMPERSAND
    Some('\''), // 0x27 APOSTROPHE
    Some('('), // 0x28 LEFT PARENTHESIS
    Some(')'), // 0x29 RIGHT PARENTHESIS
    Some('*'), // 0x2A ASTERISK
    Some('+'), // 0x2B PLUS SIGN
    Some(','), // 0x2C COMMA
    Some('-'), // 0x2D HYPHEN-MINUS
    Some('.'), // 0x2E FULL STOP
    Some('/'), // 0x2F SOLIDUS
    Some('0'), // 0x30 DIGIT ZERO
    Some('1'), // 0x31 DIGIT ONE
    Some('2'), // 0x32 DIGIT TWO
    Some('3'), // 0x33 DIGIT THREE
    Some('4'), // 0x34 DIGIT FOUR
    Some('5'), // 0x35 DIGIT FIVE
    Some('6'), // 0x36 DIGIT SIX
    Some('7'), // 0x37 DIGIT SEVEN
    Some('8'), // 0x38 DIGIT EIGHT
    Some('9'), // 0x39 DIGIT NINE
    Some(':'), // 0x3A COLON
    Some(';'), // 0x3B SEMICOLON
    Some('<'), // 0x3C LESS-THAN SIGN
    Some('='), // 0x3D EQUALS SIGN
    Some('>'), // 0x3E GREATER-THAN SIGN
    Some('?'), // 0x3F QUESTION MARK
    Some('¡'), // 0x40 INVERTED EXCLAMATION MARK (not '@', which is 0x00)
    Some('A'), // 0x41 LATIN CAPITAL LETTER A
    Some('B'), // 0x42 LATIN CAPITAL LETTER B
    Some('C'), // 0x43 LATIN CAPITAL LETTER C
    Some('D'), // 0x44 LATIN CAPITAL LETTER D
    Some('E'), // 0x45 LATIN CAPITAL LETTER E
    Some('F'), // 0x46 LATIN CAPITAL LETTER F
    Some('G'), // 0x47 LATIN CAPITAL LETTER G
    Some('H'), // 0x48 LATIN CAPITAL LETTER H
    Some('I'), // 0x49 LATIN CAPITAL LETTER I
    Some('J'), // 0x4A LATIN CAPITAL LETTER J
    Some('K'), // 0x4B LATIN CAPITAL LETTER K
    Some('L'), // 0x4C LATIN CAPITAL LETTER L
    Some('M'), // 0x4D LATIN CAPITAL LETTER M
    Some('N'), // 0x4E LATIN CAPITAL LETTER N
    Some('O'), // 0x4F LATIN CAPITAL LETTER O
    Some('P'), // 0x50 LATIN CAPITAL LETTER P
    Some('Q'), // 0x51 LATIN CAPITAL LETTER Q
    Some('R'), // 0x52 LATIN CAPITAL LETTER R
    Some('S'), // 0x53 LATIN CAPITAL LETTER S
    Some('T'), // 0x54 LATIN CAPITAL LETTER T
    Some('U'), // 0x55 LATIN CAPITAL LETTER U
    Some('V'), // 0x56 LATIN CAPITAL LETTER V
    Some('W'), // 0x57 LATIN CAPITAL LETTER W
    Some('X'), // 0x58 LATIN CAPITAL LETTER X
    Some('Y'), // 0x59 LATIN CAPITAL LETTER Y
    Some('Z'), // 0x5A LATIN CAPITAL LETTER Z
    Some('Ä'), // 0x5B LATIN CAPITAL LETTER A WITH DIAERESIS
    Some('Ö'), // 0x5C LATIN CAPITAL LETTER O WITH DIAERESIS
    Some('Ñ'), // 0x5D LATIN CAPITAL LETTER N WITH TILDE
    Some('Ü'), // 0x5E LATIN CAPITAL LETTER U WITH DIAERESIS
    Some('§'), // 0x5F SECTION SIGN
    Some('¿'), // 0x60 INVERTED QUESTION MARK
    Some('a'), // 0x61 LATIN SMALL LETTER A
    Some('b'), // 0x62 LATIN SMALL LETTER B
    Some('c'), // 0x63 LATIN SMALL LETTER C
    Some('d'), // 0x64 LATIN SMALL LETTER D
    Some('e'), // 0x65 LATIN SMALL LETTER E
    Some('f'), // 0x66 LATIN SMALL LETTER F
    Some('g'), // 0x67 LATIN SMALL LETTER G
    Some('h'), // 0x68 LATIN SMALL LETTER H
    Some('i'), // 0x69 LATIN SMALL LETTER I
    Some('j'), // 0x6A LATIN SMALL LETTER J
    Some('k'), // 0x6B LATIN SMALL LETTER K
    Some('l'), // 0x6C LATIN SMALL LETTER L
    Some('m'), // 0x6D LATIN SMALL LETTER M
    Some('n'), // 0x6E LATIN SMALL LETTER N
    Some('o'), // 0x6F LATIN SMALL LETTER O
    Some('p'), // 0x70 LATIN SMALL LETTER P
    Some('q'), // 0x71 LATIN SMALL LETTER Q
    Some('r'), // 0x72 LATIN SMALL LETTER R
    Some('s'), // 0x73 LATIN SMALL LETTER S
    Some('t'), // 0x74 LATIN SMALL LETTER T
    Some('u'), // 0x75 LATIN SMALL LETTER U
    Some('v'), // 0x76 LATIN SMALL LETTER V
    Some('w'), // 0x77 LATIN SMALL LETTER W
    Some('x'), // 0x78 LATIN SMALL LETTER X
    Some('y'), // 0x79 LATIN SMALL LETTER Y
    Some('z'), // 0x7A LATIN SMALL LETTER Z
    Some('ä'), // 0x7B LATIN SMALL LETTER A WITH DIAERESIS
    Some('ö'), // 0x7C LATIN SMALL LETTER O WITH DIAERESIS
    Some('ñ'), // 0x7D LATIN SMALL LETTER N WITH TILDE
    Some('ü'), // 0x7E LATIN SMALL LETTER U WITH DIAERESIS
    Some('à'), // 0x7F LATIN SMALL LETTER A WITH GRAVE
];

/// The default alphabet extension table, 3GPP TS 23.038 §6.2.1.1: the septet
/// that follows the escape (0x1B) and the character it stands for. Positions
/// the standard reserves (0x0D for a control, 0x1B for a further extension
/// table) hold no character and are left out, as are the unused positions,
/// which a receiver would show as the default-alphabet character instead.
const EXTENSION_TABLE: [(u8, char); 10] = [
    (0x0A, '\u{0C}'), // FORM FEED (page break)
    (0x14, '^'),      // CIRCUMFLEX ACCENT
    (0x28, '{'),      // LEFT CURLY BRACKET
    (0x29, '}'),      // RIGHT CURLY BRACKET
    (0x2F, '\\'),     // REVERSE SOLIDUS
    (0x3C, '['),      // LEFT SQUARE BRACKET
    (0x3D, '~'),      // TILDE
    (0x3E, ']'),      // RIGHT SQUARE BRACKET
    (0x40, '|'),      // VERTICAL LINE
    (0x65, '€'),      // EURO SIGN
];

/// Whether a character is in the GSM 7-bit default alphabet (3GPP TS 23.038 §6.2.1).
///
/// Such a character takes one septet. The escape (0x1B) is not a character,
/// so U+001B is not in the alphabet.
pub fn in_default_alphabet(c: char) -> bool {
    DEFAULT_ALPHABET.contains(&Some(c))
}

/// Whether a character is in the default alphabet extension table (reached with the escape, counts two septets).
///
/// 3GPP TS 23.038 §6.2.1.1: form feed, `^ { } \ [ ~ ] |` and `€`.
pub fn in_extension_table(c: char) -> bool {
    EXTENSION_TABLE.iter().any(|&(_, e)| e == c)
}

/// Septets a character takes in GSM 7-bit, or `None` when it has none and
/// the text must go out in UCS-2.
fn septets(c: char) -> Option<usize> {
    if in_default_alphabet(c) {
        Some(1)
    } else if in_extension_table(c) {
        // The escape septet, then the character's position in the table.
        Some(2)
    } else {
        None
    }
}

/// Measure a text as one SMS: GSM 7-bit septets when every character is in
/// the default alphabet or its extension table, UTF-16 code units in UCS-2
/// otherwise (3GPP TS 23.038 §6.2.1, §6.2.3; limits from TS 23.040
/// §9.2.3.24, one segment, no user-data header).
///
/// A text that is all GSM 7-bit stays GSM 7-bit even past 160 septets:
/// UCS-2 would not rescue it, because more than 160 septets means more than
/// 80 characters, already past the 70 units of UCS-2.
pub fn measure(text: &str) -> Measure {
    match text.chars().map(septets).sum::<Option<usize>>() {
        Some(units) => Measure {
            encoding: Encoding::Gsm7,
            units,
            limit: GSM7_LIMIT,
        },
        // UCS-2 proper has no room for characters outside the BMP; senders
        // pass them as UTF-16 surrogate pairs, so an emoji costs two units.
        None => Measure {
            encoding: Encoding::Ucs2,
            units: text.encode_utf16().count(),
            limit: UCS2_LIMIT,
        },
    }
}

/// Typographic characters a sender would swap for plain ones before sending (curly quotes and apostrophes → ' and ", en/em dash → -, ellipsis → ..., no-break space → space), common practice of SMS gateways, so a reply that only differs by typography stays in GSM 7-bit. Letters are never changed (a name keeps its ë).
///
/// One curly apostrophe would otherwise turn the whole reply into UCS-2 and
/// cut its room from 160 to 70. The hyphen and minus signs (U+2010, U+2011,
/// U+2012, U+2212) go to `-` and the narrow no-break space (U+202F) to a
/// space for the same reason. Letters stay, even those outside the GSM
/// alphabet: a misspelt name is worse than a second segment. The modifier
/// letter apostrophe (U+02BC) is a letter in names and is kept.
pub fn plain_typography(text: &str) -> String {
    let mut out = String::with_capacity(text.len());
    for c in text.chars() {
        match c {
            // Single quotation marks and the typographic apostrophe.
            '\u{2018}' | '\u{2019}' | '\u{201A}' | '\u{201B}' => out.push('\''),
            // Double quotation marks.
            '\u{201C}' | '\u{201D}' | '\u{201E}' | '\u{201F}' => out.push('"'),
            // Hyphen, non-breaking hyphen, figure dash, en dash, em dash, minus.
            '\u{2010}' | '\u{2011}' | '\u{2012}' | '\u{2013}' | '\u{2014}' | '\u{2212}' => {
                out.push('-')
            }
            '\u{2026}' => out.push_str("..."),
            // No-break space and narrow no-break space.
            '\u{00A0}' | '\u{202F}' => out.push(' '),
            _ => out.push(c),
        }
    }
    out
}

/// `text` made to fit one segment, whatever it holds: the fit is measured
/// on this final text, and shortening goes on until it fits. In order:
///
/// 1. as it is, with plain typography;
/// 2. letters outside the GSM 7-bit tables written without their marks
///    ("Renée" keeps its é, which the alphabet has; "Zoë" becomes "Zoe" and
///    "Łukasz" "Lukasz"),
///    and any other character outside them as `?`, so the reply is sent in
///    GSM 7-bit with its 160 septets instead of UCS-2 with 70 units;
/// 3. trailing sentences dropped, keeping the first;
/// 4. trailing words dropped and "..." put in their place, never cutting a
///    word or a number.
pub fn fit_one_segment(text: &str) -> String {
    let plain = plain_typography(text);
    if measure(&plain).fits_one_segment() {
        return plain;
    }
    let gsm = transliterate(&plain);
    if measure(&gsm).fits_one_segment() {
        return gsm;
    }
    // Sentences end at ". ", "? " or "! ".
    let mut ends: Vec<usize> = gsm
        .match_indices(['.', '?', '!'])
        .map(|(i, _)| i + 1)
        .filter(|&i| gsm[i..].starts_with(' '))
        .collect();
    ends.reverse();
    for end in ends {
        let t = &gsm[..end];
        if measure(t).fits_one_segment() {
            return t.to_string();
        }
    }
    let words: Vec<&str> = gsm.split(' ').collect();
    for n in (1..words.len()).rev() {
        let t = format!(
            "{}...",
            words[..n].join(" ").trim_end_matches([',', ';', ':'])
        );
        if measure(&t).fits_one_segment() {
            return t;
        }
    }
    // One word longer than a segment: only a made-up name could be.
    gsm.chars()
        .scan(0usize, |units, c| {
            *units += septets(c).unwrap_or(1);
            (*units <= GSM7_LIMIT - 3).then_some(c)
        })
        .collect::<String>()
        + "..."
}

/// Characters outside the GSM 7-bit tables replaced: a letter by itself
/// without its marks when that is in the tables, anything else by `?`.
fn transliterate(text: &str) -> String {
    use unicode_normalization::char::is_combining_mark;
    use unicode_normalization::UnicodeNormalization;
    let mut out = String::with_capacity(text.len());
    for c in text.chars() {
        if septets(c).is_some() {
            out.push(c);
            continue;
        }
        let bare: String = std::iter::once(c)
            .nfd()
            .filter(|m| !is_combining_mark(*m))
            .collect();
        let bare = match c {
            'ł' => "l".to_string(),
            'Ł' => "L".to_string(),
            'đ' => "d".to_string(),
            'Đ' => "D".to_string(),
            'ı' => "i".to_string(),
            'œ' => "oe".to_string(),
            'Œ' => "OE".to_string(),
            'þ' => "th".to_string(),
            'Þ' => "Th".to_string(),
            _ => bare,
        };
        if !bare.is_empty() && bare.chars().all(|b| septets(b).is_some()) {
            out.push_str(&bare);
        } else {
            out.push('?');
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use proptest::prelude::*;

    proptest! {
        /// Whatever the text, the result fits one segment
        /// (3GPP TS 23.038 alphabet, TS 23.040 limits).
        #[test]
        fn any_text_is_made_to_fit_one_segment(text in "\\PC{0,400}") {
            let fitted = fit_one_segment(&text);
            prop_assert!(measure(&fitted).fits_one_segment(), "{fitted:?}");
        }

        #[test]
        fn a_text_that_fits_is_kept(text in "[A-Za-z0-9 .,]{0,160}") {
            prop_assert_eq!(fit_one_segment(&text), text);
        }
    }

    #[test]
    fn a_name_outside_the_alphabet_is_transliterated_before_anything_is_dropped() {
        // ë and ó are not in the default alphabet, é is (3GPP TS 23.038
        // §6.2.1).
        assert!(in_default_alphabet('é') && !in_default_alphabet('ë'));
        let text = "Łukasz Wróblewski (Kalvenmark) won the men's 100 m final, with Zoë Quillon second and Bandan Zorvren third.";
        assert_eq!(measure(text).encoding, Encoding::Ucs2);
        let fitted = fit_one_segment(text);
        assert_eq!(
            fitted,
            "Lukasz Wroblewski (Kalvenmark) won the men's 100 m final, with Zoe Quillon second and Bandan Zorvren third."
        );
        assert_eq!(measure(&fitted).encoding, Encoding::Gsm7);
    }

    #[test]
    fn a_long_text_loses_whole_sentences_then_whole_words() {
        let long = format!("{}. {}", "a".repeat(100), "b ".repeat(60));
        assert_eq!(fit_one_segment(&long), format!("{}.", "a".repeat(100)));
        let words = "word ".repeat(50);
        let fitted = fit_one_segment(&words);
        assert!(
            fitted.ends_with("word...") && measure(&fitted).fits_one_segment(),
            "{fitted}"
        );
    }

    use super::*;
    use std::collections::HashMap;

    // Reference: PyPI gsm0338 1.1.0 (a GSM 03.38 codec built from the Unicode
    // consortium's ETSI/GSM0338.TXT mapping), generated by (in bash, from the
    // crate root; the fixture's first line repeats it):
    //   python3 -m venv /tmp/gsm0338-venv && /tmp/gsm0338-venv/bin/pip install gsm0338==1.1.0 \
    //   && /tmp/gsm0338-venv/bin/python tests/fixtures/gen_gsm0338.py \
    //   > tests/fixtures/gsm0338_alphabet.tsv
    // The generator lists every BMP character the codec encodes and decodes
    // back to itself, with the septets it took. The one thing the codec
    // encodes that the tables here leave out is U+001B: the codec writes it
    // as the bare septet 0x1B, which TS 23.038 §6.2.1 defines as the escape
    // to the extension table (§6.2.1.1), a prefix rather than a character;
    // decoding it gives nothing back, so the round trip drops it. At 0x09
    // the codec, like TS 23.038 §6.2.1 and this table, has the capital 'Ç'
    // (GSM0338.TXT has the small 'ç' there), so the two agree.
    // The fixture is read at run time so a missing file fails this test only.
    const FIXTURE: &str = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/tests/fixtures/gsm0338_alphabet.tsv"
    );

    fn fixture() -> HashMap<u32, usize> {
        let text = std::fs::read_to_string(FIXTURE)
            .unwrap_or_else(|e| panic!("cannot read {FIXTURE}: {e}"));
        assert!(
            text.starts_with("# gsm0338 1.1.0 (PyPI)"),
            "the fixture's first line names its source"
        );
        let mut septets = HashMap::new();
        for line in text.lines() {
            if line.starts_with('#') || line.trim().is_empty() {
                continue;
            }
            let (cp, n) = line
                .split_once('\t')
                .unwrap_or_else(|| panic!("bad fixture line {line:?}"));
            let cp = u32::from_str_radix(cp, 16).expect("fixture code point");
            let n: usize = n.parse().expect("fixture septet count");
            assert!(septets.insert(cp, n).is_none(), "duplicate {cp:04X}");
        }
        septets
    }

    #[test]
    fn tables_match_the_gsm0338_codec_for_every_bmp_character() {
        let reference = fixture();
        // 127 default-alphabet characters (128 positions less the escape)
        // and 10 in the extension table.
        assert_eq!(reference.len(), 137);
        let mut checked = 0;
        for c in (0..=0xFFFF_u32).filter_map(char::from_u32) {
            let expected = reference.get(&u32::from(c)).copied();
            let cp = u32::from(c);
            assert_eq!(
                in_default_alphabet(c),
                expected == Some(1),
                "in_default_alphabet(U+{cp:04X})"
            );
            assert_eq!(
                in_extension_table(c),
                expected == Some(2),
                "in_extension_table(U+{cp:04X})"
            );
            assert_eq!(septets(c), expected, "septets(U+{cp:04X})");
            checked += 1;
        }
        // Every BMP scalar value: 65,536 less 2,048 surrogates.
        assert_eq!(checked, 0x10000 - 0x800);
    }

    #[test]
    fn tables_have_the_standard_sizes_and_no_overlap() {
        // TS 23.038 §6.2.1.1: the escape, which leads into the extension table.
        const ESCAPE: u8 = 0x1B;
        assert_eq!(DEFAULT_ALPHABET.iter().flatten().count(), 127);
        assert_eq!(DEFAULT_ALPHABET[usize::from(ESCAPE)], None);
        for &(pos, c) in &EXTENSION_TABLE {
            assert!(pos < 0x80 && pos != ESCAPE, "extension position {pos:#04X}");
            assert!(!in_default_alphabet(c), "{c:?} in both tables");
        }
    }

    #[test]
    fn hand_picked_positions_from_the_standard() {
        // TS 23.038 §6.2.1, the positions where ASCII habits mislead.
        let at = |pos: u8| DEFAULT_ALPHABET[usize::from(pos)];
        assert_eq!(at(0x00), Some('@'));
        assert_eq!(at(0x02), Some('$'));
        assert_eq!(at(0x09), Some('Ç'));
        assert_eq!(at(0x11), Some('_'));
        assert_eq!(at(0x24), Some('¤'));
        assert_eq!(at(0x40), Some('¡'));
        assert_eq!(at(0x60), Some('¿'));
        assert_eq!(at(0x1E), Some('ß'));
        assert_eq!(at(0x1F), Some('É'));
        assert_eq!(at(0x7F), Some('à'));
        // Septet counts.
        assert_eq!(septets('@'), Some(1));
        assert_eq!(septets('$'), Some(1));
        assert_eq!(septets('\n'), Some(1));
        assert_eq!(septets('\r'), Some(1));
        assert_eq!(septets('Σ'), Some(1));
        assert_eq!(septets('€'), Some(2));
        assert_eq!(septets('{'), Some(2));
        assert_eq!(septets('\u{0C}'), Some(2));
        assert_eq!(septets('ë'), None);
        assert_eq!(septets('ç'), None);
        assert_eq!(septets('`'), None);
        assert_eq!(septets('\u{1B}'), None);
        assert_eq!(measure("Zoë").encoding, Encoding::Ucs2);
    }

    #[test]
    fn gsm_text_of_160_septets_fits_and_161_does_not() {
        let fits = measure(&"a".repeat(160));
        assert_eq!(
            fits,
            Measure {
                encoding: Encoding::Gsm7,
                units: 160,
                limit: 160
            }
        );
        assert!(fits.fits_one_segment());
        let over = measure(&"a".repeat(161));
        assert_eq!((over.encoding, over.units), (Encoding::Gsm7, 161));
        assert!(!over.fits_one_segment());
    }

    #[test]
    fn extension_characters_count_two_septets() {
        let fits = measure(&"€".repeat(80));
        assert_eq!((fits.encoding, fits.units), (Encoding::Gsm7, 160));
        assert!(fits.fits_one_segment());
        let over = measure(&"€".repeat(81));
        assert_eq!((over.encoding, over.units), (Encoding::Gsm7, 162));
        assert!(!over.fits_one_segment());
        assert_eq!(measure("{a}").units, 5);
    }

    #[test]
    fn one_character_outside_gsm_makes_the_text_ucs2_with_70_units() {
        let fits = measure(&format!("ë{}", "a".repeat(69)));
        assert_eq!(
            fits,
            Measure {
                encoding: Encoding::Ucs2,
                units: 70,
                limit: 70
            }
        );
        assert!(fits.fits_one_segment());
        let over = measure(&format!("ë{}", "a".repeat(70)));
        assert_eq!((over.encoding, over.units), (Encoding::Ucs2, 71));
        assert!(!over.fits_one_segment());
        // In UCS-2 the euro is one unit like any other BMP character.
        assert_eq!(measure("ë€").units, 2);
    }

    #[test]
    fn a_character_outside_the_bmp_counts_two_units() {
        let m = measure("🏅");
        assert_eq!((m.encoding, m.units), (Encoding::Ucs2, 2));
        assert!(!measure(&format!("🏅{}", "a".repeat(69))).fits_one_segment());
        assert!(measure(&format!("🏅{}", "a".repeat(68))).fits_one_segment());
    }

    #[test]
    fn empty_text_is_gsm_and_fits() {
        let m = measure("");
        assert_eq!((m.encoding, m.units), (Encoding::Gsm7, 0));
        assert!(m.fits_one_segment());
    }

    #[test]
    fn measure_serialises_with_snake_case_encoding() {
        let json = serde_json::to_value(measure("ë")).expect("serialisable");
        assert_eq!(
            json,
            serde_json::json!({"encoding": "ucs2", "units": 1, "limit": 70})
        );
        let json = serde_json::to_value(measure("a")).expect("serialisable");
        assert_eq!(json["encoding"], "gsm7");
    }

    #[test]
    fn plain_typography_swaps_quotes_dashes_ellipsis_and_spaces() {
        assert_eq!(
            plain_typography("\u{2018}Fast\u{2019} Nadia\u{2019}s \u{201C}best\u{201D} run"),
            "'Fast' Nadia's \"best\" run"
        );
        assert_eq!(
            plain_typography("9.58\u{a0}s \u{2013} a record \u{2014} again\u{2026}"),
            "9.58 s - a record - again..."
        );
        assert_eq!(
            plain_typography("\u{2212}3 goal difference"),
            "-3 goal difference"
        );
        assert_eq!(plain_typography("12\u{202F}345"), "12 345");
    }

    #[test]
    fn plain_typography_keeps_letters_and_plain_text() {
        assert_eq!(plain_typography("Zoë Ørsted, Łukasz"), "Zoë Ørsted, Łukasz");
        assert_eq!(plain_typography("O\u{02BC}Neill"), "O\u{02BC}Neill");
        let plain = "Gold: Ana (9.58 s), {tied} 3rd - done...";
        assert_eq!(plain_typography(plain), plain);
        assert_eq!(plain_typography(""), "");
    }

    #[test]
    fn plain_typography_keeps_a_typographic_reply_in_gsm() {
        let reply = "Nadia\u{2019}s 100\u{a0}m \u{2014} 1st\u{2026}";
        assert_eq!(measure(reply).encoding, Encoding::Ucs2);
        let plain = plain_typography(reply);
        assert_eq!(measure(&plain).encoding, Encoding::Gsm7);
        assert_eq!(plain_typography(&plain), plain, "idempotent");
        // A letter outside GSM still needs UCS-2; typography cannot help.
        let name = plain_typography("Zoë\u{2019}s 100\u{a0}m");
        assert_eq!(name, "Zoë's 100 m");
        assert_eq!(measure(&name).encoding, Encoding::Ucs2);
    }
}
