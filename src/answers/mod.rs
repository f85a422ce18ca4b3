//! Answers: the operations over the data, the values they produce, the
//! wording helpers that turn them into sentences, and the channels they
//! are shaped for.
//!
//! - [`ops`]: the closed set of operations, one file each;
//! - [`value`]: values with written, spoken and SSML forms;
//! - [`words`]: numbers, ordinals, plurals, lists in English;
//! - [`channel`]: channel profiles (chat, SMS, voice, plain, and editors' own);
//! - [`realise`]: wording and values to a channel's text, SSML and emphasis;
//! - [`sms`]: one SMS segment, by 3GPP TS 23.038;
//! - [`ssml`]: SSML 1.1 documents for voice.

pub mod channel;
pub mod ops;
pub mod realise;
pub mod sms;
pub mod ssml;
pub mod value;
pub mod words;
