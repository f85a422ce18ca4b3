//! SSML 1.1 documents for voice replies (W3C Recommendation, 7 September
//! 2010). The body comes from the template renderer in [`Style::Ssml`],
//! where every piece of text is escaped and only `say-as` and `break`
//! elements are written by the service itself; this module wraps it in a
//! `speak` root with the version, the namespace and the language.
//!
//! [`Style::Ssml`]: super::value::Style::Ssml

use super::value::xml_escape;

/// The SSML namespace (SSML 1.1, §2.1).
pub const NAMESPACE: &str = "http://www.w3.org/2001/10/synthesis";

/// A whole document: one paragraph, one `s` element per sentence given.
pub fn document(language: &str, sentences: &[String]) -> String {
    let body: String = sentences
        .iter()
        .filter(|s| !s.trim().is_empty())
        // The `s` element marks the sentence, so its closing full stop is
        // left out: right after markup some engines read it as "dot".
        .map(|s| format!("<s>{}</s>", tidy(s).trim_end().trim_end_matches('.')))
        .collect();
    format!(
        "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\
         <speak version=\"1.1\" xmlns=\"{NAMESPACE}\" xml:lang=\"{}\"><p>{body}</p></speak>",
        xml_escape(language)
    )
}

/// Commas left before other punctuation where brackets were made
/// speakable ("(9.96 s)." → "nine point nine six seconds,."): the text
/// between tags never contains markup characters, so this is plain text
/// work.
fn tidy(s: &str) -> String {
    let mut out = s.to_string();
    for (from, to) in [
        (",.", "."),
        (",?", "?"),
        (",!", "!"),
        (",:", ":"),
        (",,", ","),
        ("?.", "?"),
        ("!.", "!"),
    ] {
        while out.contains(from) {
            out = out.replace(from, to);
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_document_has_the_root_the_recommendation_requires() {
        let d = document("en-GB", &["Hello.".into(), "".into()]);
        assert_eq!(
            d,
            "<?xml version=\"1.0\" encoding=\"UTF-8\"?><speak version=\"1.1\" \
             xmlns=\"http://www.w3.org/2001/10/synthesis\" xml:lang=\"en-GB\">\
             <p><s>Hello</s></p></speak>"
        );
    }
}
