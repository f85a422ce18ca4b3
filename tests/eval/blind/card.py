#!/usr/bin/env python3
"""Writes the catalogue card a blind-set writer is given: every intent's
name, what it answers and its slots, without its phrasings or wording.

    python3 tests/eval/blind/card.py intents/games > tests/eval/blind/round1/catalogue-games.md
"""
import pathlib
import sys

import yaml

folder = pathlib.Path(sys.argv[1])
print(f"# Intents of `{folder}` (names, what each answers, slots)\n")
print("| intent | what it answers | slots (kind, required) |")
print("|---|---|---|")
for path in sorted(folder.glob("*.yaml")):
    doc = yaml.safe_load(path.read_text())
    if not isinstance(doc, dict) or "intent" not in doc:
        continue
    slots = ", ".join(
        f"`{name}` ({d['entity']}{', required' if d.get('required') else ''})"
        for name, d in (doc.get("slots") or {}).items()
    ) or "none"
    summary = doc.get("summary") or {
        "greeting": "a greeting", "thanks": "thanks", "help": "what the service can do",
    }.get(doc["intent"], "")
    print(f"| `{doc['intent']}` | {summary} | {slots} |")
