//! Where a value stands in a JSON text, so that every data problem can be
//! reported at `file:line:column`.
//!
//! serde parses the records but forgets where each value was; this module
//! scans a text that serde has already accepted once more and keeps the
//! byte span of every value and object member. A problem names its place as
//! a JSON pointer (RFC 6901, `/3/entries/1/award`), and [`Spans::find`]
//! turns that into the span of the value, or of the nearest enclosing value
//! that exists when the field itself is absent.

/// The byte spans of one JSON value and of everything inside it.
#[derive(Debug, Clone)]
pub struct Spans {
    /// Byte offset of the value's first character.
    pub start: usize,
    /// Byte offset just past the value's last character.
    pub end: usize,
    kind: Kind,
}

#[derive(Debug, Clone)]
enum Kind {
    /// Members in text order: decoded name, byte offset of the name, value.
    Object(Vec<(String, usize, Spans)>),
    Array(Vec<Spans>),
    Scalar,
}

impl Spans {
    /// Scans a JSON text; `None` when it is not one JSON value (check the
    /// syntax with serde first, which says where it goes wrong).
    pub fn scan(text: &str) -> Option<Spans> {
        let mut s = Scanner {
            text,
            bytes: text.as_bytes(),
            at: 0,
            depth: 0,
        };
        let v = s.value()?;
        s.skip_space();
        (s.at == s.bytes.len()).then_some(v)
    }

    /// The items, when this value is an array.
    pub fn items(&self) -> Option<&[Spans]> {
        match &self.kind {
            Kind::Array(items) => Some(items),
            _ => None,
        }
    }

    /// The value of a member, when this value is an object that has it.
    pub fn member(&self, name: &str) -> Option<&Spans> {
        match &self.kind {
            Kind::Object(members) => members
                .iter()
                .find(|(k, _, _)| k == name)
                .map(|(_, _, v)| v),
            _ => None,
        }
    }

    /// The value at `pointer` (RFC 6901), or the deepest value on its way
    /// that exists: a field that is absent is reported at its record.
    pub fn find(&self, pointer: &str) -> &Spans {
        let mut here = self;
        for step in pointer.split('/').skip(1) {
            let step = step.replace("~1", "/").replace("~0", "~");
            let next = match &here.kind {
                Kind::Object(_) => here.member(&step),
                Kind::Array(items) => step.parse::<usize>().ok().and_then(|i| items.get(i)),
                Kind::Scalar => None,
            };
            match next {
                Some(n) => here = n,
                None => break,
            }
        }
        here
    }
}

impl Spans {
    /// The start of the string, number or literal that `offset` falls in,
    /// if it falls in one: serde stops inside a value it refuses, and a
    /// value is reported where it starts.
    pub fn scalar_at(&self, offset: usize) -> Option<usize> {
        if !(self.start..self.end).contains(&offset) {
            return None;
        }
        match &self.kind {
            Kind::Scalar => Some(self.start),
            Kind::Object(members) => members.iter().find_map(|(_, _, v)| v.scalar_at(offset)),
            Kind::Array(items) => items.iter().find_map(|v| v.scalar_at(offset)),
        }
    }

    /// The start of the innermost object that `offset` falls in.
    pub fn object_at(&self, offset: usize) -> Option<usize> {
        if !(self.start..self.end).contains(&offset) {
            return None;
        }
        let inner = match &self.kind {
            Kind::Object(members) => members.iter().find_map(|(_, _, v)| v.object_at(offset)),
            Kind::Array(items) => items.iter().find_map(|v| v.object_at(offset)),
            Kind::Scalar => None,
        };
        match (&self.kind, inner) {
            (_, Some(i)) => Some(i),
            (Kind::Object(_), None) => Some(self.start),
            _ => None,
        }
    }

    /// Where a member called `name` starts (its name, not its value), the
    /// one nearest `offset` when there are several.
    pub fn key_nearest(&self, name: &str, offset: usize) -> Option<usize> {
        let mut found = Vec::new();
        self.walk(&mut |key, at, _| {
            if key == name {
                found.push(at);
            }
        });
        found.into_iter().min_by_key(|at| at.abs_diff(offset))
    }

    /// Where a string value reading `value` starts, the one nearest
    /// `offset` when there are several.
    pub fn string_nearest(&self, text: &str, value: &str, offset: usize) -> Option<usize> {
        let quoted = format!("\"{value}\"");
        let mut found = Vec::new();
        self.walk(&mut |_, _, v| {
            if matches!(v.kind, Kind::Scalar) && text.get(v.start..v.end) == Some(&quoted) {
                found.push(v.start);
            }
        });
        found.into_iter().min_by_key(|at| at.abs_diff(offset))
    }

    /// Every member and item below this value: (name, where the name
    /// starts, value); items have no name.
    fn walk(&self, f: &mut dyn FnMut(&str, usize, &Spans)) {
        match &self.kind {
            Kind::Object(members) => {
                for (k, at, v) in members {
                    f(k, *at, v);
                    v.walk(f);
                }
            }
            Kind::Array(items) => {
                for v in items {
                    f("", v.start, v);
                    v.walk(f);
                }
            }
            Kind::Scalar => {}
        }
    }
}

/// One JSON pointer step, escaped as RFC 6901 asks (`~` → `~0`, `/` → `~1`).
pub fn escape(step: &str) -> String {
    step.replace('~', "~0").replace('/', "~1")
}

/// The 1-based line and column (in characters) of a byte offset.
pub fn line_col(text: &str, offset: usize) -> (usize, usize) {
    let mut offset = offset.min(text.len());
    while !text.is_char_boundary(offset) {
        offset -= 1;
    }
    let before = &text[..offset];
    let line = before.matches('\n').count() + 1;
    let line_start = before.rfind('\n').map_or(0, |i| i + 1);
    (line, before[line_start..].chars().count() + 1)
}

/// The byte offset of a 1-based line and column as serde_json counts them
/// (columns in bytes), clamped to the text.
pub fn offset_of(text: &str, line: usize, column: usize) -> usize {
    let line_start = if line <= 1 {
        0
    } else {
        text.match_indices('\n')
            .nth(line - 2)
            .map_or(text.len(), |(i, _)| i + 1)
    };
    (line_start + column.saturating_sub(1)).min(text.len())
}

// Deeper than serde_json's own limit (128), so any text serde accepted
// scans, and no text can exhaust the stack.
const MAX_DEPTH: usize = 256;

struct Scanner<'a> {
    text: &'a str,
    bytes: &'a [u8],
    at: usize,
    depth: usize,
}

impl Scanner<'_> {
    fn skip_space(&mut self) {
        while self
            .bytes
            .get(self.at)
            .is_some_and(|b| b.is_ascii_whitespace())
        {
            self.at += 1;
        }
    }

    fn eat(&mut self, b: u8) -> Option<()> {
        self.skip_space();
        (self.bytes.get(self.at) == Some(&b)).then(|| self.at += 1)
    }

    fn value(&mut self) -> Option<Spans> {
        self.skip_space();
        let start = self.at;
        let kind =
            match *self.bytes.get(self.at)? {
                b'{' => {
                    self.enter()?;
                    self.at += 1;
                    let mut members = Vec::new();
                    if self.eat(b'}').is_none() {
                        loop {
                            self.skip_space();
                            let at = self.at;
                            let name = self.string()?;
                            self.eat(b':')?;
                            members.push((name, at, self.value()?));
                            if self.eat(b',').is_none() {
                                self.eat(b'}')?;
                                break;
                            }
                        }
                    }
                    self.depth -= 1;
                    Kind::Object(members)
                }
                b'[' => {
                    self.enter()?;
                    self.at += 1;
                    let mut items = Vec::new();
                    if self.eat(b']').is_none() {
                        loop {
                            items.push(self.value()?);
                            if self.eat(b',').is_none() {
                                self.eat(b']')?;
                                break;
                            }
                        }
                    }
                    self.depth -= 1;
                    Kind::Array(items)
                }
                b'"' => {
                    self.string()?;
                    Kind::Scalar
                }
                _ => {
                    // A number, true, false or null: up to the next delimiter.
                    while self.bytes.get(self.at).is_some_and(|b| {
                        !matches!(b, b',' | b']' | b'}') && !b.is_ascii_whitespace()
                    }) {
                        self.at += 1;
                    }
                    if self.at == start {
                        return None;
                    }
                    Kind::Scalar
                }
            };
        Some(Spans {
            start,
            end: self.at,
            kind,
        })
    }

    fn enter(&mut self) -> Option<()> {
        self.depth += 1;
        (self.depth <= MAX_DEPTH).then_some(())
    }

    /// A string at the cursor, decoded.
    fn string(&mut self) -> Option<String> {
        let start = self.at;
        if self.bytes.get(self.at) != Some(&b'"') {
            return None;
        }
        self.at += 1;
        let mut escaped = false;
        loop {
            match *self.bytes.get(self.at)? {
                b'\\' => {
                    escaped = true;
                    self.at += 2;
                }
                b'"' => break,
                _ => self.at += 1,
            }
        }
        self.at += 1;
        let raw = self.text.get(start..self.at)?;
        if escaped {
            serde_json::from_str(raw).ok()
        } else {
            Some(raw[1..raw.len() - 1].to_string())
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    const TEXT: &str = "[\n  {\"id\": \"p1\", \"aliases\": [\"a\", \"b\"]},\n  {\n    \"id\": \"p2\",\n    \"na/me\": {\"x\": 1}\n  }\n]\n";

    fn at(pointer: &str) -> (usize, usize) {
        let spans = Spans::scan(TEXT).expect("valid JSON");
        line_col(TEXT, spans.find(pointer).start)
    }

    #[test]
    fn a_pointer_finds_the_value_it_names() {
        assert_eq!(at(""), (1, 1));
        assert_eq!(at("/0"), (2, 3));
        assert_eq!(at("/0/id"), (2, 10));
        assert_eq!(at("/0/aliases/1"), (2, 33));
        assert_eq!(at("/1/id"), (4, 11));
        assert_eq!(at("/1/na~1me/x"), (5, 20));
    }

    #[test]
    fn an_absent_field_is_found_at_its_record() {
        assert_eq!(at("/1/group"), (3, 3));
        assert_eq!(at("/7/id"), (1, 1));
        assert_eq!(at("/0/aliases/9"), (2, 27));
        assert_eq!(at("/0/id/deeper"), (2, 10));
    }

    #[test]
    fn escaped_names_are_decoded_and_multibyte_text_counts_characters() {
        let text = "{\"na\\u006de\": \"Zoë\", \"next\": 1}";
        let spans = Spans::scan(text).unwrap();
        assert_eq!(line_col(text, spans.find("/name").start), (1, 15));
        assert_eq!(line_col(text, spans.find("/next").start), (1, 30));
    }

    #[test]
    fn an_offset_inside_a_value_moves_to_its_start() {
        let spans = Spans::scan(TEXT).unwrap();
        let inside = TEXT.find("p2").unwrap() + 1;
        assert_eq!(line_col(TEXT, spans.scalar_at(inside).unwrap()), (4, 11));
        // Between values there is no value to move to.
        assert_eq!(spans.scalar_at(TEXT.find("\"na/me\"").unwrap()), None);
        let end_of_second = TEXT.rfind('}').unwrap();
        assert_eq!(
            line_col(TEXT, spans.object_at(end_of_second).unwrap()),
            (3, 3)
        );
        assert_eq!(
            line_col(TEXT, spans.key_nearest("na/me", 0).unwrap()),
            (5, 5)
        );
        assert_eq!(
            line_col(TEXT, spans.string_nearest(TEXT, "b", 0).unwrap()),
            (2, 33)
        );
        assert_eq!(spans.string_nearest(TEXT, "zzz", 0), None);
    }

    #[test]
    fn a_text_that_is_not_one_value_does_not_scan() {
        for bad in ["", "[1,", "{\"a\" 1}", "[1] [2]", "\"open", "{\"a\":}"] {
            assert!(Spans::scan(bad).is_none(), "{bad:?}");
        }
        let deep = "[".repeat(MAX_DEPTH + 1) + &"]".repeat(MAX_DEPTH + 1);
        assert!(Spans::scan(&deep).is_none());
    }

    #[test]
    fn serde_positions_turn_into_offsets() {
        let text = "ab\ncdé\nf";
        assert_eq!(offset_of(text, 1, 1), 0);
        assert_eq!(offset_of(text, 2, 3), 5);
        assert_eq!(offset_of(text, 3, 1), 8);
        assert_eq!(offset_of(text, 9, 9), text.len());
        assert_eq!(line_col(text, 5), (2, 3));
        assert_eq!(escape("a/b~c"), "a~1b~0c");
    }
}
