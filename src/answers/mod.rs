//! Answers: the operations over the data, the values they produce and the
//! wording helpers that turn them into sentences.

pub mod ops;
pub mod value;
pub mod words;
