#!/usr/bin/env python3
"""Blind question set for the election demo at 03:45 (every replay batch
applied, clock 2027-05-07T03:45+01:00).

Each turn holds the reader's words and the meaning intended (intent, slots,
focus, outcome); every fact in `says` / `never` is computed from the data by
the helpers in label_election_0345_lib.py. Writes election-0345.yaml next to
this script."""

import os
import sys

import yaml

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from label_election_0345_lib import Election, votes_str, count_word, place_str  # noqa: E402

MOMENT = "2027-05-07T03:45:00+01:00"
E = Election(MOMENT)
OUT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "election-0345.yaml")

# wards
AN, AS, BQ, CM, DV, FG = "ashvenny-north", "ashvenny-south", "brindle-quay", "caddenmill", "dunvarrick", "fennick-green"
GV, LM, MB, PH, QC, WS = "gorsevane", "lanmouth", "marrowby", "pellin-heath", "quellan-cross", "wrenlow-sands"
# parties
HAL, MPR, LAN, CGR, TGI = "harbour", "moorland", "lantern", "greens", "tollgate"

CARD = {
    "candidate_margin": {"competitor", "contest"},
    "candidate_party": {"competitor"},
    "candidate_result": {"competitor", "contest"},
    "candidates_compared": {"competitor", "rival", "contest"},
    "count_progress": {"contest"},
    "greeting": set(), "help": set(), "open_races": set(),
    "party_in_ward": {"group", "contest"},
    "party_seats": {"group"},
    "seat_totals": {"count"},
    "thanks": set(),
    "ward_leader": {"contest"},
    "ward_place": {"contest", "place"},
    "ward_results": {"contest"},
    "ward_winner": {"contest"},
}
FOCI = {"who", "how_did", "results", "count", "rank", "table", "margin", "mark", "when", "where",
        "schedule", "status", "whether", "compare", "group_of", "sport_of", "profile", "open", "chat", "other"}
OUTCOMES = {"answered", "clarify", "no_data", "not_covered", "not_understood"}


# ---------------------------------------------------------------- facts
def n(cid):
    return E.name(cid)


def win(c):
    return [n(E.winner(c))]


def win_party(c):
    w = E.winner(c)
    return [n(w), E.party_name(E.party_of(w))]


def win_votes(c):
    w = E.winner(c)
    return [n(w), votes_str(E.votes(c, w))]


def lead(c):
    return [n(E.leader(c)), votes_str(E.lead(c))]


def results(c):
    out = []
    for e in E.entries(c):
        out += [n(e["competitor"]), votes_str(E.votes(c, e["competitor"]))]
    return out


def place(c, p):
    return [n(E.at_place(c, p))]


def cparty(cid):
    return [E.party_name(E.party_of(cid)), E.ward(E.contest_of(cid))]


def cparty_only(cid):
    return [E.party_name(E.party_of(cid))]


def cward(cid):
    return [E.ward(E.contest_of(cid))]


def cres(cid):
    c = E.contest_of(cid)
    if E.place_of(c, cid) == 1:
        return [votes_str(E.votes(c, cid))]
    return [place_str(E.place_of(c, cid)), votes_str(E.votes(c, cid))]


def cvotes(cid):
    c = E.contest_of(cid)
    return [votes_str(E.votes(c, cid))]


def cshare(cid):
    c = E.contest_of(cid)
    return [E.share(c, cid)]


def cmargin(cid):
    c = E.contest_of(cid)
    if E.place_of(c, cid) == 1:
        return [votes_str(E.margin_of(cid))]
    return [n(E.at_place(c, 1)), votes_str(E.margin_of(cid))]


def beaten_by(cid):
    c = E.contest_of(cid)
    assert E.place_of(c, cid) != 1
    return [n(E.at_place(c, 1))]


def cmp(a, b):
    c = E.contest_of(a)
    assert c == E.contest_of(b)
    return [n(E.ahead(c, a, b))]


def cmp_gap(a, b):
    c = E.contest_of(a)
    return [n(E.ahead(c, a, b)), votes_str(E.gap(c, a, b))]


def pward(g, c):
    cid = E.party_candidate(g, c)
    assert cid is not None, (g, c)
    return [n(cid), votes_str(E.votes(c, cid))]


def pward_place(g, c):
    cid = E.party_candidate(g, c)
    return [n(cid), votes_str(E.votes(c, cid)), place_str(E.place_of(c, cid))]


def pward_who(g, c):
    return [n(E.party_candidate(g, c))]


def no_party_cand(g, c):
    assert E.party_candidate(g, c) is None, (g, c)
    return []


def pseats(g):
    return [count_word(E.seats()[g])]


def totals(top=None):
    table = [(g, k) for g, k in E.seat_table() if k > 0]
    if top is not None:
        # a top-N cut must not fall inside a tie
        assert top >= len(table) or table[top - 1][1] != table[top][1], "tie at the cut"
        table = table[:top]
    out = []
    for g, k in table:
        out += [E.party_name(g), count_word(k)]
    return out


def outside_top(top):
    table = [g for g, k in E.seat_table() if k > 0]
    return [E.party_name(g) for g in table[top:]]


def progress(c):
    return [E.ward(c), E.counted_pct(c)]


def declared(c):
    assert E.is_final(c)
    return [E.declared_hhmm(c)]


def stale(c, keep):
    """Vote figures of the last live count before the declaration, minus any
    string that is a substring of a correct reply's facts."""
    cur = set(results(c)) | set(keep)
    return [m for m in E.previous_marks(c) if not any(m in x or x in m for x in cur)]


def options_family(family):
    ids = E.family_matches(family)
    assert len(ids) > 1
    return [n(i) for i in ids]


def options_ward_alias(alias):
    ids = E.ward_alias_matches(alias)
    assert len(ids) > 1
    return [E.ward(i) for i in ids]


def check_given_unique(*givens):
    for g in givens:
        assert len(E.given_matches(g)) == 1, g


# ---------------------------------------------------------------- turns
def t(ask, intent, slots, focus, says=None, never=None, tags=(), outcome="answered"):
    assert intent in CARD, intent
    assert set(slots) <= CARD[intent], (intent, slots)
    for k, v in slots.items():
        if k in ("competitor", "rival"):
            assert v in E.competitors, v
        elif k == "contest":
            assert v in E.contests, v
        elif k == "group":
            assert v in E.groups, v
    assert focus in FOCI and outcome in OUTCOMES
    d = {"ask": ask, "intent": intent, "slots": dict(slots), "outcome": outcome, "focus": focus}
    if says:
        d["says"] = list(dict.fromkeys(says))
    if never:
        d["never"] = list(dict.fromkeys(never))
    tg = list(tags)
    if outcome in ("no_data", "not_covered") and "uncovered" not in tg:
        tg.append("uncovered")
    if tg:
        d["tags"] = tg
    return d


def u(ask, focus, tags=(), never=None, outcome="not_covered"):
    """A question no intent on the card answers (or not about the beat)."""
    d = {"ask": ask, "intent": "none", "outcome": outcome, "focus": focus}
    if never:
        d["never"] = list(dict.fromkeys(never))
    tg = list(tags)
    if "uncovered" not in tg:
        tg.append("uncovered")
    d["tags"] = tg
    return d


def conv(*turns, tags=()):
    d = {"conversation": list(turns)}
    if tags:
        d["tags"] = list(tags)
    return d


def one(turn):
    return turn


def chat(ask, intent, tags=()):
    return t(ask, intent, {}, "chat", tags=tags)


check_given_unique("Fianna", "Kesia", "Delphy", "Fenwick", "Juna")

# ---------------------------------------------------------------- the set
CASES = [
    # 1 greeting, winner, margin, place, thanks, new ward
    conv(
        chat("hi there", "greeting"),
        t("who won caddenmill", "ward_winner", {"contest": CM}, "who", win(CM), tags=["exact"]),
        t("by how much", "candidate_margin", {"competitor": E.winner(CM), "contest": CM}, "margin",
          cmargin(E.winner(CM)), tags=["follow_up", "ellipsis"]),
        t("and who came second", "ward_place", {"contest": CM, "place": "2"}, "who", place(CM, 2),
          tags=["follow_up", "ellipsis"]),
        chat("great thanks", "thanks", tags=["thanks_between"]),
        t("oh one more, who took gorsevane", "ward_winner", {"contest": GV}, "who", win(GV),
          tags=["new_question", "chatty"]),
    ),
    # 2 voice, mis-heard ward, majority, uncovered recount, party
    conv(
        t("who won ash venny south", "ward_winner", {"contest": AS}, "who", win(AS),
          tags=["voice", "mishearing"]),
        t("what was the majority", "candidate_margin", {"competitor": E.winner(AS), "contest": AS}, "margin",
          cmargin(E.winner(AS)), tags=["voice", "follow_up", "ellipsis"]),
        u("thats tight is there going to be a recount", "other", tags=["voice", "follow_up"]),
        t("what party is tor vain with", "candidate_party", {"competitor": E.winner(AS)}, "group_of",
          cparty_only(E.winner(AS)), tags=["voice", "mishearing", "partial"]),
    ),
    # 3 seat totals and party follow-ups
    conv(
        t("where do the seat totals stand now", "seat_totals", {}, "table", totals(), tags=["chatty"]),
        u("has anyone got a majority on the council", "whether", tags=["follow_up"]),
        t("how many have the lanterns got", "party_seats", {"group": LAN}, "count", pseats(LAN),
          tags=["follow_up", "partial"]),
        t("and the greens", "party_seats", {"group": CGR}, "count", pseats(CGR), tags=["follow_up", "ellipsis"]),
        t("tollgate?", "party_seats", {"group": TGI}, "count", pseats(TGI), tags=["follow_up", "ellipsis"]),
    ),
    # 4 ambiguous ward alias
    conv(
        t("who won ashvenny", "ward_winner", {}, "who", options_ward_alias("Ashvenny"),
          tags=["ambiguous", "clarify", "partial"], outcome="clarify"),
        t("north", "ward_winner", {"contest": AN}, "who", win(AN), tags=["follow_up", "ellipsis"]),
        t("what share of the vote did she get", "candidate_result", {"competitor": E.winner(AN), "contest": AN},
          "mark", cshare(E.winner(AN)), tags=["follow_up", "pronoun"]),
        t("and who won the south one", "ward_winner", {"contest": AS}, "who", win(AS),
          tags=["follow_up", "partial"]),
    ),
    # 5 ambiguous surname
    conv(
        t("which party is brannick standing for", "candidate_party", {}, "group_of", options_family("Brannick"),
          tags=["ambiguous", "clarify", "partial"], outcome="clarify"),
        t("the one in pellin heath", "candidate_party", {"competitor": "c35"}, "group_of", cparty_only("c35"),
          tags=["follow_up"]),
        t("how did she do there", "candidate_result", {"competitor": "c35", "contest": PH}, "how_did",
          cres("c35"), tags=["follow_up", "pronoun"]),
        t("who won it", "ward_winner", {"contest": PH}, "who", win(PH), tags=["follow_up", "pronoun"]),
    ),
    # 6 cross-ward (uncovered) and single-ward margins
    conv(
        u("what was the closest race of the night", "other"),
        t("ok then how close was ashvenny south", "ward_leader", {"contest": AS}, "margin", lead(AS),
          tags=["new_question", "chatty"]),
        t("and caddenmill", "ward_leader", {"contest": CM}, "margin", lead(CM), tags=["follow_up", "ellipsis"]),
        u("which ward had the biggest majority", "other", tags=["new_question"]),
    ),
    # 7 party seats and a restriction by time of declaration
    conv(
        t("how many seats have the harbour alliance won", "party_seats", {"group": HAL}, "count", pseats(HAL),
          tags=["exact"]),
        u("how many of those came in before 2am", "count", tags=["follow_up", "constraint"],
          never=[w for w in pseats(HAL)
                 if w != count_word(E.seats(only=lambda k: E.declared_hhmm(k) < "02:00")[HAL])]),
        t("fair enough did they win pellin heath", "party_in_ward", {"group": HAL, "contest": PH}, "whether",
          pward_who(HAL, PH), tags=["follow_up", "pronoun", "chatty"]),
    ),
    # 8 voice candidate party, result, winner
    conv(
        t("hey what party is kell thrain in", "candidate_party", {"competitor": "c28"}, "group_of",
          cparty("c28"), tags=["voice", "mishearing"]),
        t("did he win", "candidate_result", {"competitor": "c28"}, "whether", cres("c28"),
          tags=["voice", "follow_up", "pronoun"]),
        t("who won lanmouth then", "ward_winner", {"contest": LM}, "who", win(LM), tags=["voice", "follow_up"]),
        t("how many votes did rook haven get", "candidate_result", {"competitor": "c26"}, "mark", cvotes("c26"),
          tags=["voice", "mishearing", "partial"]),
    ),
    # 9 full result, progress, declaration time
    conv(
        t("full result for marrowby please", "ward_results", {"contest": MB}, "results", results(MB),
          tags=["chatty"]),
        t("is it all counted there", "count_progress", {"contest": MB}, "status", progress(MB),
          tags=["follow_up"]),
        t("when did they declare", "count_progress", {"contest": MB}, "when", declared(MB),
          tags=["follow_up", "pronoun"]),
    ),
    # 10 compare in a ward
    conv(
        t("is vossery ahead of whitmarren", "candidates_compared", {"competitor": "c30", "rival": "c31"},
          "compare", cmp("c30", "c31"), tags=["partial"]),
        t("by how many votes did vossery win", "candidate_margin", {"competitor": "c30"}, "margin",
          cmargin("c30"), tags=["follow_up", "partial"]),
        t("and how did yarrowby get on", "candidate_result", {"competitor": "c32"}, "how_did", cres("c32"),
          tags=["follow_up", "partial"]),
    ),
    # 11 typos
    conv(
        t("who wun dunvarick", "ward_winner", {"contest": DV}, "who", win(DV), tags=["misspelling"]),
        t("whats his party", "candidate_party", {"competitor": E.winner(DV)}, "group_of",
          cparty_only(E.winner(DV)), tags=["follow_up", "pronoun", "contraction"]),
        t("is that there only seat", "party_seats", {"group": E.party_of(E.winner(DV))}, "count",
          pseats(E.party_of(E.winner(DV))), tags=["follow_up", "pronoun", "misspelling"]),
    ),
    # 12 last declaration of the night
    conv(
        t("has wrenlow sands declared yet", "count_progress", {"contest": WS}, "status", progress(WS),
          tags=["exact"]),
        t("who got it", "ward_winner", {"contest": WS}, "who", win(WS), never=stale(WS, win(WS)),
          tags=["follow_up", "pronoun"]),
        t("what was the margin", "candidate_margin", {"competitor": E.winner(WS), "contest": WS}, "margin",
          cmargin(E.winner(WS)), tags=["follow_up", "ellipsis"]),
        t("whats still to come", "open_races", {}, "open", tags=["new_question", "contraction"]),
        t("so thats everything, how many seats did the greens end up with", "party_seats", {"group": CGR},
          "count", pseats(CGR), tags=["new_question", "chatty"]),
    ),
    # 13 uncovered then covered
    conv(
        u("what was turnout in gorsevane", "other"),
        u("how many people are on the electoral roll there", "count", tags=["follow_up"]),
        t("ok just tell me who won it", "ward_winner", {"contest": GV}, "who", win(GV),
          tags=["follow_up", "pronoun"]),
        t("how many votes behind was pembrev", "candidate_margin", {"competitor": "c24", "contest": GV},
          "margin", cmargin("c24"), tags=["follow_up", "partial"]),
    ),
    # 14 parties in a ward
    conv(
        t("how did the greens do in fennick green", "party_in_ward", {"group": CGR, "contest": FG}, "how_did",
          pward(CGR, FG), tags=["partial"]),
        t("and harbour", "party_in_ward", {"group": HAL, "contest": FG}, "how_did", pward_place(HAL, FG),
          tags=["follow_up", "ellipsis"]),
        t("what about moorland there", "party_in_ward", {"group": MPR, "contest": FG}, "how_did",
          pward_place(MPR, FG), tags=["follow_up", "ellipsis"]),
        t("and lantern in gorsevane", "party_in_ward", {"group": LAN, "contest": GV}, "how_did",
          no_party_cand(LAN, GV), outcome="no_data", tags=["follow_up"]),
    ),
    # 15 voice places
    conv(
        t("who came third in caddon mill", "ward_place", {"contest": CM, "place": "3"}, "who", place(CM, 3),
          tags=["voice", "mishearing", "number_words"]),
        t("and fourth", "ward_place", {"contest": CM, "place": "4"}, "who", place(CM, 4),
          tags=["voice", "follow_up", "ellipsis", "number_words"]),
        t("what party is she", "candidate_party", {"competitor": E.at_place(CM, 4)}, "group_of",
          cparty_only(E.at_place(CM, 4)), tags=["voice", "follow_up", "pronoun"]),
    ),
    # 16 leader after the declaration
    conv(
        t("who's leading in quellan cross", "ward_leader", {"contest": QC}, "who", lead(QC),
          never=stale(QC, lead(QC)), tags=["contraction"]),
        u("was dunstreth ahead earlier in the count", "whether", tags=["follow_up"]),
        t("how many votes did dunstreth finish on", "candidate_result", {"competitor": "c37"}, "mark",
          cvotes("c37"), never=stale(QC, cvotes("c37")), tags=["follow_up", "partial"]),
    ),
    # 17 top of the table
    conv(
        t("top two parties on seats?", "seat_totals", {"count": "2"}, "table", totals(2), never=outside_top(2),
          tags=["constraint"]),
        t("how many do the progressives have", "party_seats", {"group": MPR}, "count", pseats(MPR),
          tags=["follow_up", "partial"]),
        u("how many seats do you need for a majority", "count", tags=["follow_up"]),
    ),
    # 18 missing ward
    conv(
        t("who won", "ward_winner", {}, "who", tags=["missing_slot", "clarify"], outcome="clarify"),
        t("brindle quay", "ward_winner", {"contest": BQ}, "who", win(BQ), tags=["follow_up"]),
        t("how far ahead was he", "candidate_margin", {"competitor": E.winner(BQ), "contest": BQ}, "margin",
          cmargin(E.winner(BQ)), tags=["follow_up", "pronoun"]),
        t("who finished behind him", "ward_place", {"contest": BQ, "place": "2"}, "who", place(BQ, 2),
          tags=["follow_up", "pronoun"]),
    ),
    # 19 chatty morning reader
    conv(
        t("morning! been up all night watching this, can you remind me who took the seat in the heath",
          "ward_winner", {"contest": PH}, "who", win(PH), tags=["chatty", "partial"]),
        t("nice, and did she get over half the vote", "candidate_result",
          {"competitor": E.winner(PH), "contest": PH}, "whether", cshare(E.winner(PH)),
          tags=["follow_up", "pronoun"]),
        u("was that the biggest win anywhere tonight", "whether", tags=["follow_up"]),
        t("fine whatever, what about wrenlow", "ward_winner", {"contest": WS}, "who", win(WS),
          tags=["follow_up", "ellipsis", "partial"]),
    ),
    # 20 voice wards in a row, thanks
    conv(
        t("who won done varrick", "ward_winner", {"contest": DV}, "who", win(DV), tags=["voice", "mishearing"]),
        t("who won gorse vane", "ward_winner", {"contest": GV}, "who", win(GV), tags=["voice", "mishearing"]),
        t("and marrow bee", "ward_winner", {"contest": MB}, "who", win(MB),
          tags=["voice", "mishearing", "follow_up", "ellipsis"]),
        chat("thank you", "thanks", tags=["voice"]),
    ),
    # 21 a loser's margin
    conv(
        t("how much did sabeth pellagan lose by", "candidate_margin", {"competitor": "c05"}, "margin",
          cmargin("c05"), tags=["exact"]),
        u("ouch. was anywhere else that close", "other", tags=["follow_up"]),
        t("ok what about ulric fennow", "candidate_margin", {"competitor": "c13"}, "margin", cmargin("c13"),
          tags=["follow_up", "ellipsis"]),
    ),
    # 22 compares
    conv(
        t("did pim wystrel beat elric ivenhall", "candidates_compared", {"competitor": "c20", "rival": "c21"},
          "compare", cmp("c20", "c21"), tags=["exact"]),
        t("and juna tullock v pim wystrel", "candidates_compared", {"competitor": "c19", "rival": "c20"},
          "compare", cmp("c19", "c20"), tags=["follow_up"]),
        t("how many votes did tullock win by", "candidate_margin", {"competitor": "c19"}, "margin",
          cmargin("c19"), tags=["follow_up", "partial"]),
    ),
    # 23 voice party in ward
    conv(
        t("how did the harbor alliance get on in pelling heath", "party_in_ward", {"group": HAL, "contest": PH},
          "how_did", pward(HAL, PH), tags=["voice", "mishearing"]),
        t("and the civic greens", "party_in_ward", {"group": CGR, "contest": PH}, "how_did",
          pward(CGR, PH), tags=["voice", "follow_up", "ellipsis"]),
        t("who was the moreland candidate there", "party_in_ward", {"group": MPR, "contest": PH}, "who",
          pward_who(MPR, PH), tags=["voice", "follow_up", "mishearing"]),
    ),
    # 24 declaration times
    conv(
        t("is the count finished in quellan", "count_progress", {"contest": QC}, "status", progress(QC),
          tags=["partial"]),
        t("what time did it finish", "count_progress", {"contest": QC}, "when", declared(QC),
          tags=["follow_up", "pronoun"]),
        t("and brindle quay what time was that declared", "count_progress", {"contest": BQ}, "when",
          declared(BQ), tags=["follow_up"]),
        u("was that the first ward to declare", "whether", tags=["follow_up"]),
    ),
    # 25 typos, party, seats
    conv(
        t("resluts for gorsevane", "ward_results", {"contest": GV}, "results", results(GV),
          tags=["misspelling"]),
        t("whos pembrev with", "candidate_party", {"competitor": "c24"}, "group_of", cparty_only("c24"),
          tags=["follow_up", "partial", "contraction"]),
        t("did tollgate win any seats at all", "party_seats", {"group": TGI}, "count", pseats(TGI),
          tags=["follow_up"]),
    ),
    # 26 last place
    conv(
        t("who came last in fennick green", "ward_place", {"contest": FG, "place": str(len(E.entries(FG)))},
          "who", place(FG, len(E.entries(FG))), tags=["constraint"]),
        t("how many votes was that", "candidate_result", {"competitor": E.at_place(FG, len(E.entries(FG)))},
          "mark", cvotes(E.at_place(FG, len(E.entries(FG)))), tags=["follow_up"]),
        t("which party", "candidate_party", {"competitor": E.at_place(FG, len(E.entries(FG)))}, "group_of",
          cparty_only(E.at_place(FG, len(E.entries(FG)))), tags=["follow_up", "ellipsis"]),
    ),
    # 27 first names
    conv(
        t("what party is fianna in", "candidate_party", {"competitor": "c33"}, "group_of", cparty_only("c33"),
          tags=["partial"]),
        t("and kesia", "candidate_party", {"competitor": "c36"}, "group_of", cparty_only("c36"),
          tags=["follow_up", "ellipsis", "partial"]),
        t("did kesia win", "candidate_result", {"competitor": "c36"}, "whether", cres("c36"),
          tags=["follow_up", "partial"]),
    ),
    # 28 Fenwick / Fennick
    conv(
        t("who won fenwick green", "ward_winner", {"contest": FG}, "who", win(FG),
          tags=["voice", "mishearing"]),
        t("and how did fenwick savrelle do", "candidate_result", {"competitor": "c18"}, "how_did", cres("c18"),
          tags=["new_question"]),
        t("who beat him", "candidate_margin", {"competitor": "c18"}, "who", beaten_by("c18"),
          tags=["follow_up", "pronoun"]),
    ),
    # 29 relative day, declaration times
    conv(
        t("who won caddenmill last night", "ward_winner", {"contest": CM}, "who", win(CM),
          tags=["relative_day"]),
        t("and what time did they call it", "count_progress", {"contest": CM}, "when", declared(CM),
          tags=["follow_up", "pronoun"]),
        t("what about lanmouth, when was that one", "count_progress", {"contest": LM}, "when", declared(LM),
          tags=["follow_up", "ellipsis"]),
    ),
    # 30 uncovered history, then winner
    conv(
        u("how many spoilt ballots were there in ashvenny north", "count"),
        u("did the alliance hold it or was it a gain", "whether", tags=["follow_up", "pronoun"]),
        t("ok who won it then", "ward_winner", {"contest": AN}, "who", win(AN), tags=["follow_up", "pronoun"]),
    ),
    # 31 two candidates in a ward, gap
    conv(
        t("in caddenmill was corin gadrel ahead of hesper ambrell", "candidates_compared",
          {"competitor": "c14", "rival": "c15", "contest": CM}, "compare", cmp("c14", "c15"),
          tags=["exact"]),
        t("by how much", "candidates_compared", {"competitor": "c14", "rival": "c15", "contest": CM}, "margin",
          cmp_gap("c14", "c15"), tags=["follow_up", "ellipsis"]),
    ),
    # 32 voice full results
    conv(
        t("read me the results for quell and cross", "ward_results", {"contest": QC}, "results", results(QC),
          never=stale(QC, []), tags=["voice", "mishearing"]),
        t("who was fourth", "ward_place", {"contest": QC, "place": "4"}, "who", place(QC, 4),
          tags=["voice", "follow_up", "number_words"]),
        t("what party is farrowgate", "candidate_party", {"competitor": E.at_place(QC, 4)}, "group_of",
          cparty_only(E.at_place(QC, 4)), tags=["voice", "follow_up", "partial"]),
    ),
    # 33 greeting, table, biggest party, majority, thanks
    conv(
        chat("hello", "greeting"),
        t("whats the overall picture seat wise", "seat_totals", {}, "table", totals(),
          tags=["chatty", "contraction"]),
        t("which party has the most", "seat_totals", {"count": "1"}, "who", totals(1), never=outside_top(2),
          tags=["follow_up", "ellipsis"]),
        u("are they short of an overall majority", "whether", tags=["follow_up", "pronoun"]),
        chat("cheers", "thanks"),
    ),
    # 34 ward and party of a candidate
    conv(
        t("which ward is tove inglemarsh standing in", "candidate_party", {"competitor": "c42"}, "where",
          cward("c42"), tags=["exact"]),
        t("and for which party", "candidate_party", {"competitor": "c42"}, "group_of", cparty_only("c42"),
          tags=["follow_up", "ellipsis"]),
        t("did she get elected", "candidate_result", {"competitor": "c42"}, "whether", cres("c42"),
          tags=["follow_up", "pronoun"]),
    ),
    # 35 leaders in a row with aliases
    conv(
        t("whos top in lanmouth", "ward_leader", {"contest": LM}, "who", lead(LM), tags=["contraction"]),
        t("and in the quay", "ward_leader", {"contest": BQ}, "who", lead(BQ),
          tags=["follow_up", "ellipsis", "partial"]),
        t("and the sands", "ward_leader", {"contest": WS}, "who", lead(WS), never=stale(WS, lead(WS)),
          tags=["follow_up", "ellipsis", "partial"]),
    ),
    # 36 majority as a candidate's margin
    conv(
        t("what was orla quenlows majority", "candidate_margin", {"competitor": "c01"}, "margin",
          cmargin("c01"), tags=["exact"]),
        t("and delphy vardisses share", "candidate_result", {"competitor": "c02"}, "mark", cshare("c02"),
          tags=["follow_up"]),
        t("what did the lanterns get in that ward", "party_in_ward", {"group": LAN, "contest": AN}, "how_did",
          pward(LAN, AN), tags=["follow_up", "pronoun"]),
    ),
    # 37 restrictions no intent takes
    conv(
        u("who won the wards that were counted at the civic hall", "who", tags=["constraint"]),
        u("just list me every ward winner", "who", tags=["follow_up"]),
        t("fine, who won marrowby", "ward_winner", {"contest": MB}, "who", win(MB), tags=["follow_up"]),
    ),
    # 38 data does not hold it
    conv(
        u("how many women were elected", "count"),
        u("who is the youngest new councillor", "who", tags=["follow_up"]),
    ),
    # 39 voice candidate result, share, second
    conv(
        t("did nevin corrigan win", "candidate_result", {"competitor": "c12"}, "whether", cres("c12"),
          tags=["voice", "mishearing"]),
        t("what percentage did he get", "candidate_result", {"competitor": "c12"}, "mark", cshare("c12"),
          tags=["voice", "follow_up", "pronoun"]),
        t("and who was second", "ward_place", {"contest": CM, "place": "2"}, "who", place(CM, 2),
          tags=["voice", "follow_up"]),
    ),
    # 40 voice, greens' winner in Wrenlow Sands
    conv(
        t("hey tidings did glen vane win wrenlow", "candidate_result", {"competitor": "c40", "contest": WS},
          "whether", cres("c40"), never=stale(WS, cres("c40")), tags=["voice", "mishearing", "partial"]),
        t("what was her majority", "candidate_margin", {"competitor": "c40", "contest": WS}, "margin",
          cmargin("c40"), tags=["voice", "follow_up", "pronoun"]),
        t("is hester more ahead of inglemarsh", "candidates_compared", {"competitor": "c41", "rival": "c42"},
          "compare", cmp("c41", "c42"), tags=["voice", "mishearing", "partial"]),
    ),
    # 41 party seats and wards
    conv(
        t("how many councillors have the lanterns got now", "party_seats", {"group": LAN}, "count",
          pseats(LAN), tags=["partial"]),
        t("did they win brindle quay", "party_in_ward", {"group": LAN, "contest": BQ}, "whether",
          pward_who(LAN, BQ), tags=["follow_up", "pronoun"]),
        t("what about lanmouth", "party_in_ward", {"group": LAN, "contest": LM}, "whether", pward_who(LAN, LM),
          tags=["follow_up", "ellipsis"]),
        t("and what did they get in wrenlow", "party_in_ward", {"group": LAN, "contest": WS}, "how_did",
          no_party_cand(LAN, WS), outcome="no_data",
          tags=["follow_up", "pronoun", "partial"]),
    ),
    # 42 help, Independents
    conv(
        chat("what can i ask you", "help"),
        t("ok how did the independents do in quellan cross", "party_in_ward", {"group": TGI, "contest": QC},
          "how_did", pward_place(TGI, QC), tags=["partial", "new_question"]),
        t("and in gorsevane", "party_in_ward", {"group": TGI, "contest": GV}, "how_did", pward_place(TGI, GV),
          tags=["follow_up", "ellipsis"]),
        t("so close! how far off were they", "candidate_margin",
          {"competitor": E.party_candidate(TGI, GV), "contest": GV}, "margin",
          cmargin(E.party_candidate(TGI, GV)), tags=["follow_up", "pronoun", "chatty"]),
    ),
    # 43 loser, winner's party
    conv(
        t("who did ameline rennow lose to", "candidate_margin", {"competitor": "c17"}, "who", cmargin("c17"),
          tags=["exact"]),
        t("what party is the winner", "candidate_party", {"competitor": E.winner(DV)}, "group_of",
          cparty_only(E.winner(DV)), tags=["follow_up"]),
    ),
    # 44 count progress in wards declared before the end of the count
    conv(
        t("how much of pellin heath has been counted", "count_progress", {"contest": PH}, "status",
          progress(PH), tags=["exact"]),
        t("and dunvarrick", "count_progress", {"contest": DV}, "status", progress(DV),
          tags=["follow_up", "ellipsis"]),
    ),
    # 45 open races at the end of the night
    conv(
        t("any wards still counting?", "open_races", {}, "open", tags=["chatty"]),
        u("when did the last result come in", "when", tags=["follow_up"]),
        t("who won wrenlow sands", "ward_winner", {"contest": WS}, "who", win(WS), tags=["new_question"]),
    ),
    # 46 top four
    conv(
        t("give me the top four parties by seats", "seat_totals", {"count": "4"}, "table", totals(4),
          never=outside_top(4), tags=["number_words", "constraint"]),
        t("how many did harbour get", "party_seats", {"group": HAL}, "count", pseats(HAL),
          tags=["follow_up", "partial"]),
        u("and how many votes did they get across the whole county", "mark", tags=["follow_up", "pronoun"]),
    ),
    # 47 seats restricted by count venue (not covered)
    conv(
        t("how many seats did harbour win", "party_seats", {"group": HAL}, "count", pseats(HAL),
          tags=["partial"]),
        u("just counting the wards counted at lanmouth leisure centre", "count",
          tags=["follow_up", "constraint"],
          never=[w for w in pseats(HAL)
                 if w != count_word(E.seats(only=lambda k: E.contests[k]["venue"] == "Lanmouth Leisure Centre")[HAL])]),
        t("ok and who won lanmouth itself", "ward_winner", {"contest": LM}, "who", win(LM),
          tags=["follow_up", "new_question"]),
    ),
    # 48 voice on Brindle Quay
    conv(
        t("who got elected in brindle key", "ward_winner", {"contest": BQ}, "who", win_party(BQ),
          tags=["voice", "mishearing"]),
        t("how many votes did nessa mirrow and get", "candidate_result", {"competitor": "c10"}, "mark",
          cvotes("c10"), tags=["voice", "mishearing"]),
        t("and brisa hal vesk", "candidate_result", {"competitor": "c11"}, "mark", cvotes("c11"),
          tags=["voice", "mishearing", "follow_up", "ellipsis"]),
        u("how does that compare with last time", "compare", tags=["voice", "follow_up"]),
    ),
    # 49 change of subject and return
    conv(
        t("who won the ashvenny north seat", "ward_winner", {"contest": AN}, "who", win(AN), tags=["exact"]),
        t("actually first, how many seats have the moorland progressives got", "party_seats", {"group": MPR},
          "count", pseats(MPR), tags=["new_question"]),
        t("ok back to ashvenny north, who came third", "ward_place", {"contest": AN, "place": "3"}, "who",
          place(AN, 3), tags=["follow_up", "number_words"]),
        t("and what was the winning margin there", "ward_leader", {"contest": AN}, "margin", lead(AN),
          tags=["follow_up"]),
    ),
    # 50 profile-ish and bios
    conv(
        t("tell me about rosmund vossery", "candidate_result", {"competitor": "c30"}, "profile",
          cres("c30"), tags=["exact"]),
        t("which party", "candidate_party", {"competitor": "c30"}, "group_of", cparty_only("c30"),
          tags=["follow_up", "ellipsis"]),
        u("what's their background, what did they do before politics", "other",
          tags=["follow_up", "pronoun"]),
    ),
    # 51 numbers as words / digits in place
    conv(
        t("2nd place in the sands?", "ward_place", {"contest": WS, "place": "2"}, "who", place(WS, 2),
          never=stale(WS, place(WS, 2)), tags=["partial"]),
        t("and 3rd", "ward_place", {"contest": WS, "place": "3"}, "who", place(WS, 3),
          tags=["follow_up", "ellipsis"]),
        t("was there a 5th", "ward_place", {"contest": WS, "place": "5"}, "who", outcome="no_data",
          tags=["follow_up"]),
    ),
    # 52 count progress terse
    conv(
        t("caddenmill count status", "count_progress", {"contest": CM}, "status", progress(CM),
          tags=["exact"]),
        t("fennick", "count_progress", {"contest": FG}, "status", progress(FG),
          tags=["follow_up", "ellipsis", "partial"]),
        t("when was fennick green declared", "count_progress", {"contest": FG}, "when", declared(FG),
          tags=["follow_up"]),
    ),
    # 53 a ward the data does not have
    conv(
        t("who won tamsendale east", "ward_winner", {}, "who", outcome="no_data",
          never=win(AN) + win(AS)),
        t("oh maybe i mean ashvenny south", "ward_winner", {"contest": AS}, "who", win(AS),
          tags=["follow_up"]),
    ),
    # 54 a candidate the data does not have
    conv(
        t("what party is john smith standing for", "candidate_party", {}, "group_of", outcome="no_data"),
        t("what about sten lusketh", "candidate_party", {"competitor": "c16"}, "group_of", cparty("c16"),
          tags=["follow_up", "ellipsis"]),
    ),
    # 55 previous election (not covered)
    conv(
        u("who won caddenmill in 2022", "who", tags=["constraint"], never=win(CM)),
        t("and this time", "ward_winner", {"contest": CM}, "who", win(CM), tags=["follow_up", "ellipsis"]),
    ),
    # 56 mixed chatty single-ward questions
    conv(
        t("quick one - how many votes did the winner in dunvarrick get", "ward_winner", {"contest": DV},
          "mark", win_votes(DV), tags=["chatty"]),
        t("and the runner up", "ward_place", {"contest": DV, "place": "2"}, "who", place(DV, 2),
          tags=["follow_up", "ellipsis"]),
        t("what percentage was that", "candidate_result", {"competitor": E.at_place(DV, 2)}, "mark",
          cshare(E.at_place(DV, 2)), tags=["follow_up", "pronoun"]),
    ),
    # 57 Ashvenny South compare and Greens
    conv(
        t("was torvane ahead of pellagan in the end", "candidates_compared",
          {"competitor": "c06", "rival": "c05"}, "compare", cmp("c06", "c05"), tags=["partial"]),
        t("how did the greens do in that ward", "party_in_ward", {"group": CGR, "contest": AS}, "how_did",
          pward(CGR, AS), tags=["follow_up", "pronoun"]),
        t("and tollgate", "party_in_ward", {"group": TGI, "contest": AS}, "how_did", pward_place(TGI, AS),
          tags=["follow_up", "ellipsis"]),
    ),
    # 58 misc uncovered and not understood singles
    one(u("how old is ivo oskary", "other")),
    one(u("asdfgh jkl", "other", outcome="not_understood")),
    one(u("tell me a joke", "other", outcome="not_understood")),
    one(u("whats the weather doing in lanmouth", "other", outcome="not_understood")),
    one(u("where was the wrenlow sands count held", "where")),
    one(u("what share of the vote did moorland get across the county", "mark")),
    one(u("who will lead the council now", "who")),
    one(u("which moorland candidate got the most votes", "who", tags=["constraint"])),
    one(u("what did harbour alliance poll in gorsevane back in 2022", "mark", tags=["constraint"],
          never=pward(HAL, GV)[1:])),
    # singles, covered
    one(t("quenlow party?", "candidate_party", {"competitor": "c01"}, "group_of", cparty_only("c01"),
          tags=["partial"])),
    one(t("did odile yellmer get elected", "candidate_result", {"competitor": "c03"}, "whether", cres("c03"),
          tags=["exact"])),
    one(t("show me the lanmouth numbers", "ward_results", {"contest": LM}, "results", results(LM),
          tags=["chatty"])),
    one(t("full breakdown of the votes in ashvenny north ward", "ward_results", {"contest": AN}, "results",
          results(AN), tags=["exact"])),
    one(t("how did moorland do in ashvenny north", "party_in_ward", {"group": MPR, "contest": AN}, "how_did",
          pward_place(MPR, AN), tags=["partial"])),
    one(t("whos in the lead at gorsevane", "ward_leader", {"contest": GV}, "who", lead(GV),
          tags=["contraction"])),
    one(t("did ulric fennow get in", "candidate_result", {"competitor": "c13"}, "whether", cres("c13"),
          tags=["chatty"])),
    one(t("what party does joram hestermoor represent", "candidate_party", {"competitor": "c41"}, "group_of",
          cparty("c41"), tags=["exact"])),
    one(t("who came 3rd in the quay", "ward_place", {"contest": BQ, "place": "3"}, "who", place(BQ, 3),
          tags=["partial"])),
    one(t("seats won so far by the alliance", "party_seats", {"group": HAL}, "count", pseats(HAL),
          tags=["partial"])),
    one(t("give me the state of the parties", "seat_totals", {}, "table", totals(), tags=["chatty"])),
    one(t("whos ahead in fennick green and by how much", "ward_leader", {"contest": FG}, "margin", lead(FG),
          tags=["contraction"])),
    one(t("what races are still undeclared", "open_races", {}, "open")),
    one(t("help", "help", {}, "chat")),
    one(t("did gaspard torvane hold on in ashvenny south", "candidate_result",
          {"competitor": "c06", "contest": AS}, "whether", cres("c06"), tags=["exact", "chatty"])),
    one(t("pim wistrel what party", "candidate_party", {"competitor": "c20"}, "group_of", cparty_only("c20"),
          tags=["misspelling"])),
    one(t("ilsa rookhavens winning margin pls", "candidate_margin", {"competitor": "c26"}, "margin",
          cmargin("c26"), tags=["contraction", "chatty"])),
    one(t("who won the ballot in pellin", "ward_winner", {"contest": PH}, "who", win(PH), tags=["partial"])),
    one(t("how many votes did the lantern candidate get in marrowby", "party_in_ward",
          {"group": LAN, "contest": MB}, "mark", pward(LAN, MB), tags=["exact"])),
    one(t("maren umbersley result", "candidate_result", {"competitor": "c29"}, "how_did", cres("c29"),
          tags=["exact"])),
    one(t("did the toll gate independents stand in lanmouth", "party_in_ward", {"group": TGI, "contest": LM},
          "whether", no_party_cand(TGI, LM), outcome="no_data", tags=["voice", "mishearing"])),
    one(t("who came fifth in ashvenny north", "ward_place", {"contest": AN, "place": "5"}, "who",
          outcome="no_data", tags=["number_words"])),
    # 59 a longer voice conversation with return
    conv(
        t("ok google ask tidings who won lanmouth town", "ward_winner", {"contest": LM}, "who", win(LM),
          tags=["voice"]),
        t("which party's she from", "candidate_party", {"competitor": E.winner(LM)}, "group_of",
          cparty_only(E.winner(LM)), tags=["voice", "follow_up", "pronoun"]),
        t("and whats the lantern party on overall", "party_seats", {"group": LAN}, "count", pseats(LAN),
          tags=["voice", "new_question"]),
        chat("cool thanks", "thanks", tags=["voice", "thanks_between"]),
        t("back to lanmouth how far behind was mirela stellick", "candidate_margin",
          {"competitor": "c27", "contest": LM}, "margin", cmargin("c27"), tags=["voice", "follow_up"]),
        t("and kell thrane", "candidate_margin", {"competitor": "c28", "contest": LM}, "margin",
          cmargin("c28"), tags=["voice", "follow_up", "ellipsis"]),
    ),
    # 60 a reader who compares wards (not covered) and then asks one ward
    conv(
        u("which ward had the lowest vote for the winner", "mark"),
        u("and which party won the most votes overall", "who", tags=["follow_up"]),
        t("alright, whats the full result in dunvarrick", "ward_results", {"contest": DV}, "results",
          results(DV), tags=["new_question", "contraction"]),
        t("whos the tollgate candidate there", "party_in_ward", {"group": TGI, "contest": DV}, "who",
          pward_who(TGI, DV), tags=["follow_up"]),
    ),
    # 61 thanks in the middle, change of ward
    conv(
        t("gorsevane winner please", "ward_winner", {"contest": GV}, "who", win_party(GV), tags=["exact"]),
        chat("ta", "thanks", tags=["thanks_between"]),
        t("and pellin heath while im here", "ward_winner", {"contest": PH}, "who", win(PH),
          tags=["follow_up", "chatty"]),
        t("what was fianna zellick's share", "candidate_result", {"competitor": "c33"}, "mark",
          cshare("c33"), tags=["follow_up"]),
        t("and abernell's", "candidate_result", {"competitor": "c34"}, "mark", cshare("c34"),
          tags=["follow_up", "ellipsis", "partial"]),
    ),
    # 62 ward leader typo, compare
    conv(
        t("whos leadng in marowby", "ward_leader", {"contest": MB}, "who", lead(MB), tags=["misspelling"]),
        t("is whitmarren ahead of yarrowby", "candidates_compared", {"competitor": "c31", "rival": "c32"},
          "compare", cmp("c31", "c32"), tags=["follow_up", "partial"]),
        u("who were the three candidates there last election", "who", tags=["follow_up", "constraint"]),
    ),
    # 63 voice: Quellan Cross winner and the Greens (who did not stand)
    conv(
        t("who won quellan cross", "ward_winner", {"contest": QC}, "who", win(QC), never=stale(QC, win(QC)),
          tags=["exact"]),
        t("how many votes did kesia carravine get", "candidate_result", {"competitor": "c36"}, "mark",
          cvotes("c36"), tags=["follow_up"]),
        t("did the greens have anyone there", "party_in_ward", {"group": CGR, "contest": QC}, "whether",
          no_party_cand(CGR, QC), outcome="no_data", tags=["follow_up"]),
        t("and the lanterns", "party_in_ward", {"group": LAN, "contest": QC}, "how_did", pward_place(LAN, QC),
          tags=["follow_up", "ellipsis"]),
    ),
]


# ---------------------------------------------------------------- write
def turns_of(case):
    return case["conversation"] if "conversation" in case else [case]


def main():
    all_turns = [tt for c in CASES for tt in turns_of(c)]
    uncovered = [tt for tt in all_turns if "uncovered" in tt.get("tags", [])]
    convs = [c for c in CASES if "conversation" in c]
    for c in convs:
        assert 2 <= len(c["conversation"]) <= 6, c
    asks = [tt["ask"] for tt in all_turns]
    dup = {a for a in asks if asks.count(a) > 1 and len(a) > 12}
    assert not dup, dup
    for tt in all_turns:
        assert "focus" in tt
        for x in tt.get("never", []):
            assert not any(x.lower() in s.lower() for s in tt.get("says", [])), (tt["ask"], x)
    header = (
        "# Blind question set: scenario election, moment 03:45\n"
        "# (every replay batch applied; clock 2027-05-07T03:45+01:00).\n"
        "# Written by tests/eval/blind/round6/label_election_0345.py"
        " (helpers in label_election_0345_lib.py);\n"
        "# every says/never fact is computed from dataset-demo/election/.\n"
        "# %d cases (%d conversations), %d turns, %d uncovered (%.1f%%).\n"
        % (len(CASES), len(convs), len(all_turns), len(uncovered), 100.0 * len(uncovered) / len(all_turns))
    )
    with open(OUT, "w", encoding="utf-8") as f:
        f.write(header)
        yaml.safe_dump(CASES, f, sort_keys=False, allow_unicode=True, width=110)
    print(header, end="")


if __name__ == "__main__":
    main()
