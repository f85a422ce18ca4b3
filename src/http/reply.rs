//! The reply as a client receives it: the engine's whole answer, less the
//! fields that only explain how it was reached (`candidates`, `facts`)
//! unless the message asked for them with `"explain": true`.
//!
//! Why by default without them: a chat platform or a phone line shows the
//! text and perhaps the options; the runner-up intents and the facts behind
//! the wording are for the desk, for tuning and for checking, and made up
//! most of a reply's bytes.
//!
//! Why here and not in the engine: the engine keeps the whole answer (the
//! reply kept for a retried message included), so a retry that asks for
//! the explanation gets it, and tools that call the engine directly (the
//! evaluation, conversation scripts, `tidings ask --json`) see everything.
//! The fields are left out while the answer is written, by a serializer
//! that skips them at the top level, so the other fields keep their order
//! and a retry gets the very same bytes as the first reply.

use serde::ser::{Serialize, SerializeMap, SerializeStruct, Serializer};

use crate::engine::Answer;

/// The fields that only explain a reply.
pub const EXPLAIN_FIELDS: [&str; 2] = ["candidates", "facts"];

/// An answer as it goes out on the message API.
pub struct Sent {
    pub answer: Answer,
    /// Whether the message asked for `candidates` and `facts`.
    pub explain: bool,
}

impl Serialize for Sent {
    fn serialize<S: Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        if self.explain {
            self.answer.serialize(s)
        } else {
            self.answer.serialize(Without {
                inner: s,
                skip: &EXPLAIN_FIELDS,
            })
        }
    }
}

/// A serializer that leaves out the top-level fields named in `skip` and
/// writes everything else through `inner` unchanged.
struct Without<'k, S> {
    inner: S,
    skip: &'k [&'k str],
}

/// Whether a map key is one of `skip`: keys of a struct written as a map
/// (as a flattened struct is) are strings; any other key is kept.
fn skipped<K: Serialize + ?Sized>(key: &K, skip: &[&str]) -> bool {
    matches!(serde_json::to_value(key), Ok(serde_json::Value::String(k)) if skip.contains(&k.as_str()))
}

struct WithoutMap<'k, M> {
    inner: M,
    skip: &'k [&'k str],
    /// Set between a skipped key and its value.
    skipping: bool,
}

impl<M: SerializeMap> SerializeMap for WithoutMap<'_, M> {
    type Ok = M::Ok;
    type Error = M::Error;

    fn serialize_key<T: Serialize + ?Sized>(&mut self, key: &T) -> Result<(), M::Error> {
        self.skipping = skipped(key, self.skip);
        if self.skipping {
            return Ok(());
        }
        self.inner.serialize_key(key)
    }

    fn serialize_value<T: Serialize + ?Sized>(&mut self, value: &T) -> Result<(), M::Error> {
        if std::mem::take(&mut self.skipping) {
            return Ok(());
        }
        self.inner.serialize_value(value)
    }

    fn serialize_entry<K: Serialize + ?Sized, V: Serialize + ?Sized>(
        &mut self,
        key: &K,
        value: &V,
    ) -> Result<(), M::Error> {
        if skipped(key, self.skip) {
            return Ok(());
        }
        self.inner.serialize_entry(key, value)
    }

    fn end(self) -> Result<M::Ok, M::Error> {
        self.inner.end()
    }
}

struct WithoutStruct<'k, T> {
    inner: T,
    skip: &'k [&'k str],
}

impl<T: SerializeStruct> SerializeStruct for WithoutStruct<'_, T> {
    type Ok = T::Ok;
    type Error = T::Error;

    fn serialize_field<V: Serialize + ?Sized>(
        &mut self,
        key: &'static str,
        value: &V,
    ) -> Result<(), T::Error> {
        if self.skip.contains(&key) {
            return self.inner.skip_field(key);
        }
        self.inner.serialize_field(key, value)
    }

    fn end(self) -> Result<T::Ok, T::Error> {
        self.inner.end()
    }
}

impl<'k, S: Serializer> Serializer for Without<'k, S> {
    type Ok = S::Ok;
    type Error = S::Error;
    type SerializeSeq = S::SerializeSeq;
    type SerializeTuple = S::SerializeTuple;
    type SerializeTupleStruct = S::SerializeTupleStruct;
    type SerializeTupleVariant = S::SerializeTupleVariant;
    type SerializeMap = WithoutMap<'k, S::SerializeMap>;
    type SerializeStruct = WithoutStruct<'k, S::SerializeStruct>;
    type SerializeStructVariant = S::SerializeStructVariant;

    fn serialize_map(self, len: Option<usize>) -> Result<Self::SerializeMap, S::Error> {
        // The length is not known once fields are left out.
        let _ = len;
        Ok(WithoutMap {
            inner: self.inner.serialize_map(None)?,
            skip: self.skip,
            skipping: false,
        })
    }

    fn serialize_struct(
        self,
        name: &'static str,
        len: usize,
    ) -> Result<Self::SerializeStruct, S::Error> {
        Ok(WithoutStruct {
            inner: self.inner.serialize_struct(name, len)?,
            skip: self.skip,
        })
    }

    // Anything but a map or a struct has no fields to leave out.
    fn serialize_bool(self, v: bool) -> Result<S::Ok, S::Error> {
        self.inner.serialize_bool(v)
    }
    fn serialize_i8(self, v: i8) -> Result<S::Ok, S::Error> {
        self.inner.serialize_i8(v)
    }
    fn serialize_i16(self, v: i16) -> Result<S::Ok, S::Error> {
        self.inner.serialize_i16(v)
    }
    fn serialize_i32(self, v: i32) -> Result<S::Ok, S::Error> {
        self.inner.serialize_i32(v)
    }
    fn serialize_i64(self, v: i64) -> Result<S::Ok, S::Error> {
        self.inner.serialize_i64(v)
    }
    fn serialize_u8(self, v: u8) -> Result<S::Ok, S::Error> {
        self.inner.serialize_u8(v)
    }
    fn serialize_u16(self, v: u16) -> Result<S::Ok, S::Error> {
        self.inner.serialize_u16(v)
    }
    fn serialize_u32(self, v: u32) -> Result<S::Ok, S::Error> {
        self.inner.serialize_u32(v)
    }
    fn serialize_u64(self, v: u64) -> Result<S::Ok, S::Error> {
        self.inner.serialize_u64(v)
    }
    fn serialize_f32(self, v: f32) -> Result<S::Ok, S::Error> {
        self.inner.serialize_f32(v)
    }
    fn serialize_f64(self, v: f64) -> Result<S::Ok, S::Error> {
        self.inner.serialize_f64(v)
    }
    fn serialize_char(self, v: char) -> Result<S::Ok, S::Error> {
        self.inner.serialize_char(v)
    }
    fn serialize_str(self, v: &str) -> Result<S::Ok, S::Error> {
        self.inner.serialize_str(v)
    }
    fn serialize_bytes(self, v: &[u8]) -> Result<S::Ok, S::Error> {
        self.inner.serialize_bytes(v)
    }
    fn serialize_none(self) -> Result<S::Ok, S::Error> {
        self.inner.serialize_none()
    }
    fn serialize_some<T: Serialize + ?Sized>(self, v: &T) -> Result<S::Ok, S::Error> {
        self.inner.serialize_some(v)
    }
    fn serialize_unit(self) -> Result<S::Ok, S::Error> {
        self.inner.serialize_unit()
    }
    fn serialize_unit_struct(self, name: &'static str) -> Result<S::Ok, S::Error> {
        self.inner.serialize_unit_struct(name)
    }
    fn serialize_unit_variant(
        self,
        name: &'static str,
        index: u32,
        variant: &'static str,
    ) -> Result<S::Ok, S::Error> {
        self.inner.serialize_unit_variant(name, index, variant)
    }
    fn serialize_newtype_struct<T: Serialize + ?Sized>(
        self,
        name: &'static str,
        v: &T,
    ) -> Result<S::Ok, S::Error> {
        self.inner.serialize_newtype_struct(name, v)
    }
    fn serialize_newtype_variant<T: Serialize + ?Sized>(
        self,
        name: &'static str,
        index: u32,
        variant: &'static str,
        v: &T,
    ) -> Result<S::Ok, S::Error> {
        self.inner
            .serialize_newtype_variant(name, index, variant, v)
    }
    fn serialize_seq(self, len: Option<usize>) -> Result<S::SerializeSeq, S::Error> {
        self.inner.serialize_seq(len)
    }
    fn serialize_tuple(self, len: usize) -> Result<S::SerializeTuple, S::Error> {
        self.inner.serialize_tuple(len)
    }
    fn serialize_tuple_struct(
        self,
        name: &'static str,
        len: usize,
    ) -> Result<S::SerializeTupleStruct, S::Error> {
        self.inner.serialize_tuple_struct(name, len)
    }
    fn serialize_tuple_variant(
        self,
        name: &'static str,
        index: u32,
        variant: &'static str,
        len: usize,
    ) -> Result<S::SerializeTupleVariant, S::Error> {
        self.inner
            .serialize_tuple_variant(name, index, variant, len)
    }
    fn serialize_struct_variant(
        self,
        name: &'static str,
        index: u32,
        variant: &'static str,
        len: usize,
    ) -> Result<S::SerializeStructVariant, S::Error> {
        self.inner
            .serialize_struct_variant(name, index, variant, len)
    }
    fn is_human_readable(&self) -> bool {
        self.inner.is_human_readable()
    }
}

#[cfg(test)]
mod tests {
    use std::sync::Arc;

    use super::*;
    use crate::dialogue::MemoryStore;
    use crate::engine::{self, Clock, Engine, Settings, Sources};

    async fn answer(text: &str) -> Answer {
        let snap = engine::load(&Sources::default()).expect("the demo loads");
        let settings = Settings::with_clock(
            Clock::Fixed("2027-08-14T21:10:00+01:00".parse().unwrap()),
            b"test-secret".to_vec(),
        );
        Engine::new(snap, Arc::new(MemoryStore::new()), settings)
            .handle("reply-test", "chat", text)
            .await
            .unwrap()
    }

    fn keys(json: &str) -> Vec<String> {
        // Top-level keys in the order written: where each first shows in
        // the text (in these replies a top-level key comes before any
        // nested key of the same name).
        let v: serde_json::Value = serde_json::from_str(json).unwrap();
        let mut keys: Vec<(usize, String)> = v
            .as_object()
            .unwrap()
            .keys()
            .map(|k| (json.find(&format!("\"{k}\":")).unwrap(), k.clone()))
            .collect();
        keys.sort();
        keys.into_iter().map(|(_, k)| k).collect()
    }

    #[tokio::test]
    async fn explained_it_is_the_whole_answer_and_otherwise_the_same_less_two_fields() {
        let a = answer("who won the men's 100 m?").await;
        assert!(!a.reply.facts.is_empty() && !a.reply.candidates.is_empty());
        let whole = serde_json::to_string(&a).unwrap();
        let explained = serde_json::to_string(&Sent {
            answer: a.clone(),
            explain: true,
        })
        .unwrap();
        assert_eq!(explained, whole);
        let plain = serde_json::to_string(&Sent {
            answer: a,
            explain: false,
        })
        .unwrap();
        let want: Vec<String> = keys(&whole)
            .into_iter()
            .filter(|k| !EXPLAIN_FIELDS.contains(&k.as_str()))
            .collect();
        assert_eq!(keys(&plain), want);
        let (p, w): (serde_json::Value, serde_json::Value) = (
            serde_json::from_str(&plain).unwrap(),
            serde_json::from_str(&whole).unwrap(),
        );
        for k in &want {
            assert_eq!(p[k], w[k], "{k}");
        }
        assert!(plain.len() < whole.len() / 2, "{plain}");
    }
}
