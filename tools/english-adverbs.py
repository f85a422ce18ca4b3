#!/usr/bin/env python3
"""Writes src/understand/english-adverbs.txt: the single English words that
WordNet 3.0 (as Debian's `wordnet-base` package ships it) uses mostly as
adverbs. A word counts when its adverb senses are tagged more often in the
sense-tagged corpus than its senses of any other part of speech (ties go to
the part of speech with more synsets, then to the adverb), so "altogether"
and "roughly" are in and "still" (an adjective more often) is not.

The understander uses the list so that a reader's adverb ("altogether",
"roughly") lowers its confidence without making the question one it cannot
answer: an adverb rarely changes what is asked, a noun often does.

Usage: python3 tools/english-adverbs.py [WORDNET_DIR]   (prints the list)
"""
import sys

DIR = sys.argv[1] if len(sys.argv) > 1 else "/usr/share/wordnet"


def parts_of_speech(d):
    """word -> {pos: (tagged sense count, synset count)}"""
    seen = {}
    for pos in ("noun", "verb", "adj", "adv"):
        with open(f"{d}/index.{pos}", encoding="latin-1") as f:
            for line in f:
                if line.startswith(" "):
                    continue  # the licence header
                fields = line.split()
                word = fields[0]
                if not word.isalpha() or not word.islower() or len(word) < 3:
                    continue
                synsets, pointers = int(fields[2]), int(fields[3])
                tagged = int(fields[4 + pointers + 1])
                seen.setdefault(word, {})[pos] = (tagged, synsets)
    return seen


def adverbs(seen):
    out = []
    for word, by in seen.items():
        if "adv" not in by:
            continue
        best = max(by.items(), key=lambda kv: (kv[1], kv[0] == "adv"))
        if best[0] == "adv":
            out.append(word)
    return sorted(out)


if __name__ == "__main__":
    words = adverbs(parts_of_speech(DIR))
    print("# Single words WordNet 3.0 (Debian package wordnet-base) uses mostly as adverbs,")
    print("# by tagged sense count. Regenerate with tools/english-adverbs.py > this file.")
    print("\n".join(words))
