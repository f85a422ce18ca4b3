#!/usr/bin/env python3
"""Blind question set for the games scenario, labelled from the data.

Moment: Saturday 14 August 2027, 21:10 (Europe/Lisbon, +01:00); data as of 21:04.
Reads dataset-demo/games/*.json, holds the questions with their meanings as
data, computes every expected fact from the data and writes games.yaml.
Python 3 standard library + PyYAML.
"""
import collections
import json
import os

import yaml

HERE = os.path.dirname(os.path.abspath(__file__))
DATA = os.path.normpath(os.path.join(HERE, "..", "..", "..", "..", "dataset-demo", "games"))


def load(name):
    with open(os.path.join(DATA, name), encoding="utf-8") as f:
        return json.load(f)


SCEN = load("scenario.json")
CONTESTS = {c["id"]: c for c in load("contests.json")}
PEOPLE = {p["id"]: p for p in load("competitors.json")}
GROUPS = {g["id"]: g for g in load("groups.json")}
SPORTS = {s["id"]: s for s in load("sports.json")}
CLOCK = SCEN["clock"][:16]          # "2027-08-14T21:10"
TODAY = CLOCK[:10]
TOMORROW = "2027-08-15"
YESTERDAY = "2027-08-13"
assert TODAY == "2027-08-14"
AWARDS = ["gold", "silver", "bronze"]

WORDS = ["zero", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine"]


def cnt(n):
    return WORDS[n] if 0 <= n < 10 else str(n)


def ordinal(n):
    if 10 <= n % 100 <= 20:
        suf = "th"
    else:
        suf = {1: "st", 2: "nd", 3: "rd"}.get(n % 10, "th")
    return "%d%s" % (n, suf)


def nm(pid):
    p = PEOPLE[pid]
    return p["given"] + " " + p["family"]


def gname(gid):
    return GROUPS[gid]["name"]


def C(cid):
    return CONTESTS[cid]


def ent_name(e):
    return nm(e["competitor"]) if "competitor" in e else gname(e["group"])


def ent_group(e):
    return e["group"] if "group" in e else PEOPLE[e["competitor"]]["group"]


def fmt(cid, mark):
    m = C(cid)["measure"]
    if m == "time":
        return mark if ":" in mark else mark + " s"
    if m == "distance":
        return mark + " m"
    return mark


def placed(cid, n):
    return [e for e in C(cid)["entries"] if e.get("place") == n]


def at(cid, n):
    """Names at place n (a list; ties give several)."""
    out = [ent_name(e) for e in placed(cid, n)]
    assert out, (cid, n)
    return out


def mark_at(cid, n):
    e = placed(cid, n)
    assert len(e) >= 1
    return fmt(cid, e[0]["mark"])


def medal(cid, award):
    out = [ent_name(e) for e in C(cid)["entries"] if e.get("award") == award]
    assert C(cid)["status"] == "final"
    return out


def podium(cid):
    out = []
    for a in AWARDS:
        out += medal(cid, a)
    return out


def entry_of(cid, pid):
    for e in C(cid)["entries"]:
        if e.get("competitor") == pid or pid in e.get("members", []) or e.get("group") == pid:
            return e
    raise KeyError((cid, pid))


def place_of(cid, pid):
    return entry_of(cid, pid)["place"]


def mark_of(cid, pid):
    return fmt(cid, entry_of(cid, pid)["mark"])


def secs(mark):
    parts = [float(x) for x in mark.split(":")]
    v = 0.0
    for x in parts:
        v = v * 60 + x
    return v


def gap(cid, a_place, b_place):
    """Absolute difference of marks between two places, as printed digits."""
    ea, eb = placed(cid, a_place)[0], placed(cid, b_place)[0]
    m = C(cid)["measure"]
    d = abs(secs(ea["mark"]) - secs(eb["mark"]))
    if m == "points" and C(cid)["sport"] == "basketball":
        return "%d" % round(d)
    dec = max(len(ea["mark"].split(".")[-1]) if "." in ea["mark"] else 0,
              len(eb["mark"].split(".")[-1]) if "." in eb["mark"] else 0)
    out = ("%." + str(dec) + "f") % d
    if "." in out:
        out = out.rstrip("0").rstrip(".")
    return out


def contests_of(pid):
    out = []
    for c in CONTESTS.values():
        for e in c["entries"]:
            if e.get("competitor") == pid or pid in e.get("members", []):
                out.append(c["id"])
    return sorted(out, key=lambda x: C(x)["start"])


def next_of(pid):
    ups = [c for c in contests_of(pid) if C(c)["status"] == "scheduled" and C(c)["start"] > CLOCK]
    return ups[0] if ups else None


def comp_medals(pid, award=None):
    n = 0
    for c in contests_of(pid):
        e = entry_of(c, pid)
        if "award" in e and (award is None or e["award"] == award):
            n += 1
    return n


def tally(sport=None, date=None):
    t = {g: {"gold": 0, "silver": 0, "bronze": 0} for g in GROUPS}
    for c in CONTESTS.values():
        if sport and c["sport"] != sport:
            continue
        if date and not c["start"].startswith(date):
            continue
        for e in c["entries"]:
            if "award" in e:
                t[ent_group(e)][e["award"]] += 1
    return t


def table(sport=None, date=None, award=None):
    t = tally(sport, date)
    if award:
        key = lambda g: (-t[g][award],)
    else:
        key = lambda g: (-t[g]["gold"], -t[g]["silver"], -t[g]["bronze"])
    order = sorted([g for g in t if sum(t[g].values())], key=key)
    return t, order, key


def rank(gid, sport=None, date=None, award=None):
    t, order, key = table(sport, date, award)
    return 1 + sum(1 for g in order if key(g) < key(gid))


def leaders(sport=None, date=None, award=None):
    t, order, key = table(sport, date, award)
    return [gname(g) for g in order if key(g) == key(order[0])]


def top(n, sport=None, date=None, award=None):
    t, order, key = table(sport, date, award)
    return [gname(g) for g in order[:n]]


def gmedals(gid, sport=None, date=None, award=None):
    t = tally(sport, date)[gid]
    return t[award] if award else sum(t.values())


def most_total(sport=None, date=None):
    t = tally(sport, date)
    best = max(sum(v.values()) for v in t.values())
    return [gname(g) for g in t if sum(t[g].values()) == best], best


def on_day(date, sport=None):
    return sorted([c for c in CONTESTS.values() if c["start"].startswith(date)
                   and (sport is None or c["sport"] == sport)], key=lambda c: c["start"])


def live(sport=None):
    return [c for c in CONTESTS.values() if c["status"] == "live" and (sport is None or c["sport"] == sport)]


def dname(c):
    """A discipline's display name for a contest (what any reply naming it must contain)."""
    if c["sport"] == "basketball":
        return "basketball"
    for d in SPORTS[c["sport"]]["disciplines"]:
        if d["id"] == c["discipline"]:
            return d["name"]
    raise KeyError(c["id"])


def hhmm(cid):
    return C(cid)["start"][11:16]


def best(sport, disc, category=None):
    """Best mark so far over finished or live contests (time: lowest; else highest)."""
    marks = []
    for c in CONTESTS.values():
        if c["sport"] != sport or c["discipline"] != disc:
            continue
        if category and c["category"] != category:
            continue
        for e in c["entries"]:
            if "mark" in e and e.get("status") is None:
                marks.append((c["id"], e))
    if C(marks[0][0])["measure"] == "time":
        bestv = min(secs(e["mark"]) for _, e in marks)
    else:
        bestv = max(secs(e["mark"]) for _, e in marks)
    hits = [(cid, e) for cid, e in marks if secs(e["mark"]) == bestv]
    return fmt(hits[0][0], hits[0][1]["mark"]), [ent_name(e) for _, e in hits]


# ---------------------------------------------------------------- cases

def T(ask, intent, slots=None, outcome="answered", focus="other", says=None, never=None, tags=None):
    t = {"ask": ask, "intent": intent}
    if intent != "none":
        t["slots"] = dict(slots or {})
    t["outcome"] = outcome
    t["focus"] = focus
    if says:
        t["says"] = [str(s) for s in says]
    if never:
        t["never"] = [str(s) for s in never]
    if tags:
        t["tags"] = list(tags)
    return t


def U(ask, focus="other", tags=None, never=None, outcome="not_covered"):
    """A question no intent answers."""
    tg = list(tags or [])
    if "uncovered" not in tg:
        tg.append("uncovered")
    return T(ask, "none", outcome=outcome, focus=focus, never=never, tags=tg)


def CONV(*turns, tags=None):
    tg = set(tags or [])
    turns = list(turns)
    for t in turns:
        tg.update(t.get("tags", []))
    return {"conversation": turns, "tags": sorted(tg)}


CASES = []
ADD = CASES.append

# ---------------------------------------------------------------- questions
M100, M200, M400, M1500, MLJ = ("ath-m-100m-final", "ath-m-200m-final", "ath-m-400m-final",
                               "ath-m-1500m-final", "ath-m-long-jump-final")
W100, W200, W400, W1500, WLJ = ("ath-w-100m-final", "ath-w-200m-final", "ath-w-400m-final",
                               "ath-w-1500m-final", "ath-w-long-jump-final")
W100H1, W100H2, M100H1, M100H2 = ("ath-w-100m-heat-1", "ath-w-100m-heat-2",
                                  "ath-m-100m-heat-1", "ath-m-100m-heat-2")
WMAR, MMAR, MHJ, WHJ, MJAV, WJAV = ("ath-w-marathon-final", "ath-m-marathon-final", "ath-m-high-jump-final",
                                    "ath-w-high-jump-final", "ath-m-javelin-final", "ath-w-javelin-final")
SW100F, SM100F, SW200F, SM200F = ("swm-w-100m-freestyle-final", "swm-m-100m-freestyle-final",
                                  "swm-w-200m-freestyle-final", "swm-m-200m-freestyle-final")
SW200B, SM200B, SW100BR, SM100BR = ("swm-w-200m-butterfly-final", "swm-m-200m-butterfly-final",
                                    "swm-w-100m-breaststroke-final", "swm-m-100m-breaststroke-final")
SW400IM, SM400IM = "swm-w-400m-individual-medley-final", "swm-m-400m-individual-medley-final"
RW1X, RM1X, RM2X, RW2X = ("row-w-single-sculls-final", "row-m-single-sculls-final",
                          "row-m-double-sculls-final", "row-w-double-sculls-final")
CMRR, CWRR, CWTT, CMTT = ("cyc-m-road-race-final", "cyc-w-road-race-final",
                          "cyc-w-time-trial-final", "cyc-m-time-trial-final")
GMAA, GWAA, GWFX, GMFX, GWVT, GMVT = ("gym-m-all-around-final", "gym-w-all-around-final", "gym-w-floor-final",
                                      "gym-m-floor-final", "gym-w-vault-final", "gym-m-vault-final")
BKM, BKW = "bkb-m-tournament-final", "bkb-w-tournament-final"
for _c in list(globals()):
    pass
for _cid in (M100, M200, M400, M1500, MLJ, W100, W200, W400, W1500, WLJ, W100H1, W100H2, M100H1, M100H2,
             WMAR, MMAR, MHJ, WHJ, MJAV, WJAV, SW100F, SM100F, SW200F, SM200F, SW200B, SM200B, SW100BR,
             SM100BR, SW400IM, SM400IM, RW1X, RM1X, RM2X, RW2X, CMRR, CWRR, CWTT, CMTT, GMAA, GWAA, GWFX,
             GMFX, GWVT, GMVT, BKM, BKW):
    assert _cid in CONTESTS, _cid


def pid_of(full):
    hits = [p for p in PEOPLE if nm(p) == full]
    assert len(hits) == 1, full
    return hits[0]


GALKACE = pid_of("Wonorin Galkace")
DOSAVORN = pid_of("Lirust Dosavorn")
ZORVREN = pid_of("Bandan Zorvren")
DORRAGO = pid_of("Hulek Dorrago")
HINELL = pid_of("Trulorin Hinell")
QUILLON = pid_of("Zoë Quillon")
MARRANT = pid_of("Zoë Marrant")
TASSEVAR = pid_of("Zoë Tassevar")
CORDVELLE = pid_of("Anaïs Cordvelle")
GULELICK = pid_of("Bana Gulelick")
HALMVIK = pid_of("Jørund Halmvik")
DUNMARK = pid_of("Tobiah Dünmark")
BRELWICK = pid_of("Tetha Brelwick")
NUVASKO = pid_of("Hothic Nuvasko")
WENDEROW = pid_of("Łucja Wenderow")
DULVAIRE = pid_of("Çenna Dulvaire")
TOLLEVANT = pid_of("Émeric Tollevant")
ZILKEDORN = pid_of("Hanel Zilkedorn")
DOVONASKO = pid_of("Krundena Dovonasko")
MORRESSI = pid_of("Banel Morressi")
KERRETH = pid_of("Lomov Kerreth")
CEDELL = pid_of("Krarrek Cedell")
S_KOVENDAL = pid_of("Stemelle Kovendal")
B_KOVENDAL = pid_of("Boran Kovendal")
HERVOVETH = pid_of("Sondora Hervoveth")
BROSSAYNE = pid_of("Tuthette Brossayne")
OSTRAVIN = pid_of("Renée Ostravin")
SARROMELL = pid_of("Onov Sarromell")
FUSTISESSI = pid_of("Issov Fustisessi")
VAMWICK = pid_of("Gethard Vamwick")
BRUSSAND = pid_of("Hurra Brussand")
ZEVERT = pid_of("Thumard Zevert")
FEMWICK = pid_of("Terrette Femwick")

# ---- batch 1: single questions
ADD(T("who won the mens 100m", "podium", {"contest": M100}, focus="who",
      says=medal(M100, "gold"), tags=["exact", "contraction"]))
ADD(T("Who took silver in the men's 200 m?", "medalist", {"contest": M200, "award": "silver"}, focus="who",
      says=medal(M200, "silver"), never=medal(M200, "gold"), tags=["exact"]))
ADD(T("medal table pls", "medal_table_top", {}, focus="table",
      says=top(3), tags=["chatty"]))
ADD(T("who's top of the medal table right now", "medal_table_leader", {}, focus="who",
      says=leaders(), tags=["contraction"]))
ADD(T("how many golds has vastrelia got", "delegation_medals", {"group": "vastrelia", "award": "gold"},
      focus="count", says=[cnt(gmedals("vastrelia", award="gold"))], tags=["contraction"]))
ADD(T("what's on tomorrow", "schedule_day", {"date": TOMORROW}, focus="schedule",
      says=[dname(c) for c in on_day(TOMORROW)], tags=["relative_day", "contraction"]))
ADD(T("whats happening right now", "under_way", {}, focus="schedule",
      says=[dname(c) for c in live()], tags=["contraction"]))
ADD(T("who is leading the mens marathon", "live_leader", {"contest": MMAR}, focus="who",
      says=at(MMAR, 1), tags=["exact"]))
ADD(T("when is the women's 100m final", "contest_time", {"contest": W100}, focus="when",
      says=[hhmm(W100)], tags=["exact"]))
ADD(T("where's the swimming being held, the women's 400 IM i mean", "contest_time", {"contest": SW400IM},
      focus="where", says=[C(SW400IM)["venue"]], tags=["chatty", "contraction"]))
ADD(T("what country does Galkace run for", "competitor_delegation", {"competitor": GALKACE},
      focus="group_of", says=[gname(PEOPLE[GALKACE]["group"])], tags=["partial"]))
ADD(T("how many medals has the quay rocket won", "competitor_medals", {"competitor": GALKACE},
      focus="count", says=[cnt(comp_medals(GALKACE))], tags=["alias"]))
ADD(T("what sport does jory do", "competitor_sport", {"competitor": HALMVIK}, focus="sport_of",
      says=["swimming"], tags=["alias"]))
ADD(T("full results of the women's long jump", "full_results", {"contest": WLJ}, focus="results",
      says=at(WLJ, 1) + at(WLJ, 2) + [mark_at(WLJ, 1), mark_at(WLJ, 2)], tags=["exact"]))
ADD(T("who came fourth in the men's 100", "contest_place", {"contest": M100, "place": "4"}, focus="who",
      says=at(M100, 4), never=medal(M100, "gold"), tags=["number_words"]))
ADD(T("how did anais cordvelle do in her heat", "competitor_result", {"competitor": CORDVELLE, "contest": W100H1},
      focus="how_did", says=[ordinal(place_of(W100H1, CORDVELLE)), mark_of(W100H1, CORDVELLE)],
      tags=["diacritics", "constraint"]))
ADD(T("did Dosavorn beat Zorvren in the 100m final", "head_to_head",
      {"competitor": DOSAVORN, "rival": ZORVREN, "contest": M100}, focus="compare",
      says=[nm(DOSAVORN)], tags=["partial"]))
ADD(T("when does anais cordvelle race next", "competitor_next", {"competitor": CORDVELLE}, focus="when",
      says=[hhmm(next_of(CORDVELLE))], tags=["diacritics"]))
ADD(T("what's the longest long jump so far", "best_mark", {"discipline": "athletics/long-jump"}, focus="mark",
      says=[best("athletics", "long-jump")[0]], tags=["contraction"]))
ADD(T("hi there", "greeting", {}, focus="chat", tags=["chatty"]))
ADD(T("what can you do", "help", {}, focus="chat", tags=["exact"]))
ADD(T("thanks a lot!", "thanks", {}, focus="chat", tags=["chatty"]))
ADD(U("what's the world record in the men's 100m", focus="mark", never=[best("athletics", "100m", "men")[0]]))
ADD(U("is it going to rain for the cycling time trial on tuesday", focus="other"))
ADD(U("how tall is bana gulelick", focus="other"))
ADD(U("where can i buy tickets for the basketball final", focus="other"))

ADD(CONV(
    T("who won the women's 200m", "podium", {"contest": W200}, focus="who", says=medal(W200, "gold"),
      tags=["exact"]),
    T("and bronze?", "medalist", {"contest": W200, "award": "bronze"}, focus="who",
      says=medal(W200, "bronze"), never=medal(W200, "gold"), tags=["follow_up", "ellipsis"]),
    T("what time did she run", "competitor_result", {"competitor": pid_of(medal(W200, "bronze")[0]), "contest": W200},
      focus="mark", says=[mark_of(W200, pid_of(medal(W200, "bronze")[0]))], tags=["pronoun", "follow_up"]),
))
ADD(CONV(
    T("how is dunmerrow doing in the medals", "delegation_medals", {"group": "dunmerrow"}, focus="count",
      says=[cnt(gmedals("dunmerrow")), ordinal(rank("dunmerrow"))], tags=["exact"]),
    T("and how many of those are gold", "delegation_medals", {"group": "dunmerrow", "award": "gold"}, focus="count",
      says=[cnt(gmedals("dunmerrow", award="gold"))], tags=["follow_up", "pronoun"]),
    T("cheers", "thanks", {}, focus="chat", tags=["chatty"]),
))
ADD(CONV(
    T("when does zoe race next", "competitor_next", {}, outcome="clarify", focus="when",
      says=[nm(QUILLON), nm(MARRANT), nm(TASSEVAR)], tags=["ambiguous", "clarify", "diacritics"]),
    T("the swimmer", "competitor_next", {"competitor": QUILLON}, focus="when",
      says=[hhmm(next_of(QUILLON))], tags=["follow_up", "clarify"]),
))
# ---- batch 2
def res(cid, pid):
    """Facts of one athlete's result: the mark, and the place when off the podium."""
    e = entry_of(cid, pid)
    out = [fmt(cid, e["mark"])] if "mark" in e and e.get("status") is None else []
    if e.get("place") and e["place"] > 3:
        out.append(ordinal(e["place"]))
    if "award" in e:
        out.append(e["award"])
    return out


def margin(cid, pid):
    """Gap to the next athlete (winner) or to the winner (runner-up), as digits."""
    p = place_of(cid, pid)
    assert p in (1, 2)
    return gap(cid, 1, 2)


ADD(T("who got gold in the womens marathon", "medalist", {"contest": WMAR, "award": "gold"}, focus="who",
      says=medal(WMAR, "gold"), tags=["contraction"]))
ADD(T("javelin women winner?", "podium", {"contest": WJAV}, focus="who",
      says=medal(WJAV, "gold"), tags=["diacritics", "terse"]))
ADD(T("how did hinell go in the 100 metres final", "competitor_result", {"competitor": HINELL, "contest": M100},
      focus="how_did", says=res(M100, HINELL), tags=["partial"]))
ADD(T("give me the top 5 in the men's 1500", "full_results", {"contest": M1500, "count": "5"}, focus="results",
      says=sum([at(M1500, i) for i in range(1, 6)], []), never=at(M1500, 6), tags=["constraint"]))
ADD(T("who came third on floor in the women's final", "contest_place", {"contest": GWFX, "place": "3"},
      focus="who", says=at(GWFX, 3), never=medal(GWFX, "gold"), tags=["exact"]))
ADD(T("who was runner up in the mens single sculls", "contest_place", {"contest": RM1X, "place": "2"},
      focus="who", says=at(RM1X, 2), never=at(RM1X, 1), tags=["contraction"]))
ADD(T("final score in the men's basketball?", "full_results", {"contest": BKM}, focus="results",
      says=[at(BKM, 1)[0], at(BKM, 2)[0], placed(BKM, 1)[0]["mark"], placed(BKM, 2)[0]["mark"]], tags=["exact"]))
ADD(T("how did orrindel get on in the men's basketball", "delegation_in_event", {"group": "orrindel", "contest": BKM},
      focus="how_did", says=["bronze"], tags=["exact"]))
ADD(T("brellmoor double sculls result", "delegation_in_event", {"group": "brellmoor", "contest": RM2X},
      focus="how_did", says=[entry_of(RM2X, "brellmoor")["award"], fmt(RM2X, entry_of(RM2X, "brellmoor")["mark"])],
      tags=["terse"]))
ADD(T("how many swimming medals has kalvenmark won", "delegation_medals", {"group": "kalvenmark", "sport": "swimming"},
      focus="count", says=[cnt(gmedals("kalvenmark", sport="swimming"))], tags=["constraint"]))
ADD(T("how many bronzes for myrrhaven", "delegation_medals", {"group": "myrrhaven", "award": "bronze"},
      focus="count", says=[cnt(gmedals("myrrhaven", award="bronze"))], tags=["terse"]))
ADD(T("where is halvorne in the medal table", "delegation_medals", {"group": "halvorne"}, focus="rank",
      says=[ordinal(rank("halvorne"))], tags=["exact"]))
ADD(T("show me the top five of the medals table", "medal_table_top", {"count": "5"}, focus="table",
      says=top(5), never=[top(6)[5]], tags=["number_words"]))
ADD(T("who leads the swimming medals", "medal_table_leader", {"sport": "swimming"}, focus="who",
      says=leaders(sport="swimming"), tags=["constraint"]))
ADD(T("which country has won the most medals overall", "most_medals", {}, focus="who",
      says=most_total()[0], tags=["exact"]))
ADD(T("who has the most golds", "most_medals", {"award": "gold"}, focus="who",
      says=leaders(award="gold"), tags=["terse"]))
ADD(T("whats on in the athletics tomorrow", "schedule_day", {"date": TOMORROW, "sport": "athletics"},
      focus="schedule", says=[dname(c) for c in on_day(TOMORROW, "athletics")] + [hhmm(W100)],
      never=[dname(C(SW400IM))], tags=["relative_day", "constraint", "contraction"]))
ADD(T("what events are on monday", "schedule_day", {"date": "2027-08-16"}, focus="schedule",
      says=[dname(c) for c in on_day("2027-08-16")], tags=["constraint"]))
ADD(T("anything on in gymnastics at the moment?", "under_way", {"sport": "gymnastics"}, focus="schedule",
      says=[dname(c) for c in live("gymnastics")], never=["javelin", "marathon"], tags=["constraint"]))
ADD(T("who's leading the men's javelin", "live_leader", {"contest": MJAV}, focus="who",
      says=at(MJAV, 1), tags=["contraction"]))
ADD(T("how high has kerreth cleared so far", "competitor_result", {"competitor": KERRETH, "contest": MHJ},
      focus="mark", says=[mark_of(MHJ, KERRETH)], tags=["partial"]))
ADD(T("fastest 100 free this week?", "best_mark", {"discipline": "swimming/100m-freestyle"}, focus="mark",
      says=[best("swimming", "100m-freestyle")[0]], tags=["alias"]))
ADD(T("best score on floor for the women", "best_mark", {"discipline": "gymnastics/floor", "category": "women"},
      focus="mark", says=[best("gymnastics", "floor", "women")[0]], tags=["constraint"]))
ADD(T("which team does big tobi play for", "competitor_delegation", {"competitor": DUNMARK}, focus="group_of",
      says=[gname(PEOPLE[DUNMARK]["group"])], tags=["alias"]))
ADD(T("what does tobiah dunmark play", "competitor_sport", {"competitor": DUNMARK}, focus="sport_of",
      says=["basketball"], tags=["diacritics"]))
ADD(T("tell me about tetha brelwick", "competitor_profile", {"competitor": BRELWICK}, focus="profile",
      says=[mark_of(CWRR, BRELWICK), mark_of(CWTT, BRELWICK)], tags=["exact"]))
ADD(T("how many golds does brelwick have", "competitor_medals", {"competitor": BRELWICK, "award": "gold"},
      focus="count", says=[cnt(comp_medals(BRELWICK, "gold"))], tags=["partial"]))
ADD(T("renee ostravin medal count", "competitor_medals", {"competitor": OSTRAVIN}, focus="count",
      says=[cnt(comp_medals(OSTRAVIN))], tags=["diacritics", "terse"]))
ADD(T("how far behind was brossayne in the long jump", "competitor_margin", {"competitor": BROSSAYNE, "contest": WLJ},
      focus="margin", says=[margin(WLJ, BROSSAYNE), nm(HERVOVETH)], tags=["partial"]))
ADD(T("by how much did galkace win the 200", "competitor_margin", {"competitor": GALKACE, "contest": M200},
      focus="margin", says=[margin(M200, GALKACE)], tags=["partial"]))
ADD(T("when's the men's time trial", "contest_time", {"contest": CMTT}, focus="when",
      says=[hhmm(CMTT)], tags=["contraction"]))
ADD(T("where is the womens basketball final being played", "contest_time", {"contest": BKW}, focus="where",
      says=[C(BKW)["venue"]], tags=["contraction"]))
ADD(T("what time does the women's high jump start", "contest_time", {"contest": WHJ}, focus="when",
      says=[hhmm(WHJ)], tags=["exact"]))
ADD(T("who won the women's 100m", "podium", {"contest": W100}, outcome="no_data", focus="who",
      tags=["no_data"]))
ADD(T("who won the men's 400 IM", "podium", {"contest": SM400IM}, outcome="no_data", focus="who",
      tags=["no_data", "alias"]))
ADD(T("who won the men's 10000m", "podium", {}, outcome="no_data", focus="who",
      never=medal(M1500, "gold"), tags=["no_data"]))
ADD(T("results of the men's 200m backstroke", "full_results", {}, outcome="no_data", focus="results",
      never=medal(SM200B, "gold") + medal(SM200F, "gold"), tags=["no_data"]))
ADD(T("does galkace compete for quessary?", "competitor_delegation", {"competitor": GALKACE}, focus="group_of",
      says=[gname(PEOPLE[GALKACE]["group"])], tags=["partial"]))
ADD(T("jorund halmvik how did he do in the 200 free", "competitor_result", {"competitor": HALMVIK, "contest": SM200F},
      focus="how_did", says=res(SM200F, HALMVIK), tags=["diacritics", "alias"]))
ADD(T("did zoe quillon get a medal in the butterfly", "competitor_result", {"competitor": QUILLON, "contest": SW200B},
      focus="whether", says=res(SW200B, QUILLON), tags=["diacritics"]))
ADD(T("how many medals has quillon got", "competitor_medals", {"competitor": QUILLON}, focus="count",
      says=[cnt(comp_medals(QUILLON))], tags=["partial"]))
ADD(T("who beat hurra brussand in the 100 breast", "competitor_margin", {"competitor": BRUSSAND, "contest": SW100BR},
      focus="who", says=at(SW100BR, 1) + at(SW100BR, 2), tags=["alias"]))
ADD(T("who's ahead in the womens all-around", "live_leader", {"contest": GWAA}, focus="who",
      says=at(GWAA, 1), tags=["contraction"]))
ADD(T("men's road race top three", "podium", {"contest": CMRR}, focus="results",
      says=podium(CMRR), never=at(CMRR, 4), tags=["terse"]))
ADD(T("who won the mens hundred meters", "podium", {"contest": M100}, focus="who", says=medal(M100, "gold"),
      tags=["voice", "number_words"]))
ADD(T("how did emmerick tollevant do in the hundred metres final", "competitor_result",
      {"competitor": TOLLEVANT, "contest": M100}, focus="how_did", says=res(M100, TOLLEVANT),
      tags=["voice", "mishearing", "diacritics", "number_words"]))
ADD(T("who came second in the fifteen hundred for the women", "contest_place", {"contest": W1500, "place": "2"},
      focus="who", says=at(W1500, 2), never=at(W1500, 1), tags=["voice", "number_words"]))
ADD(T("top ten in the women's road race please", "full_results", {"contest": CWRR, "count": "10"},
      focus="results", says=sum([at(CWRR, i) for i in range(1, 11)], []), never=at(CWRR, 11),
      tags=["constraint"]))

ADD(U("how old is wonorin galkace", focus="other"))
ADD(U("who coaches the dunmerrow basketball team", focus="other"))
ADD(U("which lane was galkace in for the 100 final", focus="other"))
ADD(U("what was the wind reading in the men's 100m final", focus="other"))
ADD(U("what channel is showing the women's 100m final tomorrow", focus="other", tags=["relative_day"]))
ADD(U("how many athletes has kalvenmark sent to the games", focus="count"))
ADD(U("which athlete has won the most medals", focus="who"))
ADD(U("how many medals did galkace win on friday", focus="count", tags=["constraint"],
      never=[cnt(comp_medals(GALKACE))]))
ADD(U("medal table for the women's events only", focus="table", tags=["constraint"]))
ADD(U("when is the closing ceremony", focus="when"))
ADD(U("how many countries are at the games", focus="count"))
ADD(U("did anyone break a games record today", focus="whether", tags=["relative_day"]))
ADD(U("what's galkace's personal best in the 100", focus="mark"))
ADD(U("who won the men's 100m at the last games", focus="who", never=medal(M100, "gold")))
ADD(U("how many medals has zoe quillon won in freestyle", focus="count", tags=["constraint", "diacritics"],
      never=[cnt(comp_medals(QUILLON))]))
ADD(U("who scored the most points for dunmerrow in the final", focus="who"))
ADD(U("asdfgh jkl", outcome="not_understood", focus="other", tags=["gibberish"]))
ADD(U("play some music", outcome="not_understood", focus="other"))
ADD(U("what's the capital of france", outcome="not_understood", focus="other"))
# ---- batch 3: conversations
_lj_gold = pid_of(medal(MLJ, "gold")[0])
ADD(CONV(
    T("who won the men's long jump", "podium", {"contest": MLJ}, focus="who", says=medal(MLJ, "gold"),
      tags=["exact"]),
    T("how far did he jump", "competitor_result", {"competitor": _lj_gold, "contest": MLJ}, focus="mark",
      says=[mark_of(MLJ, _lj_gold)], tags=["pronoun", "follow_up"]),
    T("and who was second", "contest_place", {"contest": MLJ, "place": "2"}, focus="who",
      says=at(MLJ, 2), never=at(MLJ, 1), tags=["follow_up", "ellipsis"]),
    T("by how much did he lose", "competitor_margin", {"competitor": pid_of(at(MLJ, 2)[0]), "contest": MLJ},
      focus="margin", says=[gap(MLJ, 1, 2)], tags=["pronoun", "follow_up"]),
))
ADD(CONV(
    T("how's kalvenmark doing", "delegation_medals", {"group": "kalvenmark"}, focus="count",
      says=[cnt(gmedals("kalvenmark")), ordinal(rank("kalvenmark"))], tags=["contraction", "chatty"]),
    T("what about just in swimming", "delegation_medals", {"group": "kalvenmark", "sport": "swimming"},
      focus="count", says=[cnt(gmedals("kalvenmark", sport="swimming"))], tags=["follow_up", "constraint"]),
    T("and orrindel?", "delegation_medals", {"group": "orrindel", "sport": "swimming"}, focus="count",
      says=[cnt(gmedals("orrindel", sport="swimming"))], tags=["follow_up", "ellipsis"]),
))
_qnext = next_of(QUILLON)
ADD(CONV(
    T("tell me about zoe quillon", "competitor_profile", {"competitor": QUILLON}, focus="profile",
      says=["silver", "bronze"], tags=["diacritics"]),
    T("when's her next race", "competitor_next", {"competitor": QUILLON}, focus="when",
      says=[hhmm(_qnext)], tags=["pronoun", "follow_up", "contraction"]),
    T("where is that", "contest_time", {"contest": _qnext}, focus="where",
      says=[C(_qnext)["venue"]], tags=["pronoun", "follow_up"]),
))
_aa = pid_of(at(GWAA, 1)[0])
ADD(CONV(
    T("who's leading the womens all around", "live_leader", {"contest": GWAA}, focus="who",
      says=at(GWAA, 1), tags=["contraction"]),
    T("which country is she from", "competitor_delegation", {"competitor": _aa}, focus="group_of",
      says=[gname(PEOPLE[_aa]["group"])], tags=["pronoun", "follow_up"]),
    T("thank you", "thanks", {}, focus="chat", tags=["thanks_between"]),
    T("what about the men's high jump, who's on top there", "live_leader", {"contest": MHJ}, focus="who",
      says=at(MHJ, 1), tags=["new_question"]),
))
ADD(CONV(
    T("what's on today", "schedule_day", {"date": TODAY}, focus="schedule",
      says=sorted(set(dname(c) for c in on_day(TODAY))), tags=["relative_day"]),
    T("just the athletics", "schedule_day", {"date": TODAY, "sport": "athletics"}, focus="schedule",
      says=sorted(set(dname(c) for c in on_day(TODAY, "athletics"))), never=["basketball", "all-around"],
      tags=["follow_up", "constraint", "ellipsis"]),
    T("and whats going on right now", "under_way", {}, focus="schedule",
      says=[dname(c) for c in live()], tags=["follow_up"]),
))
_hin_h = [c for c in contests_of(HINELL) if "heat" in C(c)["phase"]][0]
ADD(CONV(
    T("who won the 100m men's final", "podium", {"contest": M100}, focus="who", says=medal(M100, "gold"),
      tags=["exact"]),
    T("how did hinell do", "competitor_result", {"competitor": HINELL, "contest": M100}, focus="how_did",
      says=res(M100, HINELL), tags=["partial", "follow_up"]),
    T("and in his heat?", "competitor_result", {"competitor": HINELL, "contest": _hin_h}, focus="how_did",
      says=[mark_of(_hin_h, HINELL), ordinal(place_of(_hin_h, HINELL))], tags=["pronoun", "follow_up", "constraint"]),
))
ADD(CONV(
    T("tell me about kovendal", "competitor_profile", {}, outcome="clarify", focus="profile",
      says=[nm(S_KOVENDAL), nm(B_KOVENDAL)], tags=["ambiguous", "partial"]),
    T("the rower", "competitor_profile", {"competitor": B_KOVENDAL}, focus="profile",
      says=res(RM1X, B_KOVENDAL), tags=["clarify", "follow_up"]),
    T("ok and the swimmer, how many medals has she got", "competitor_medals", {"competitor": S_KOVENDAL},
      focus="count", says=[cnt(comp_medals(S_KOVENDAL))], tags=["follow_up", "pronoun"]),
))
ADD(CONV(
    T("who won the women's 100m final", "podium", {"contest": W100}, outcome="no_data", focus="who",
      tags=["no_data"]),
    T("when is it then", "contest_time", {"contest": W100}, focus="when", says=[hhmm(W100)],
      tags=["pronoun", "follow_up"]),
    T("ok what about the men's", "podium", {"contest": M100}, focus="who", says=medal(M100, "gold"),
      tags=["follow_up", "ellipsis"]),
))
ADD(CONV(
    T("was galkace ahead of dorrago in the 200", "head_to_head", {"competitor": GALKACE, "rival": DORRAGO,
      "contest": M200}, focus="compare", says=[nm(GALKACE)], tags=["partial"]),
    T("and in the 100 final?", "head_to_head", {"competitor": GALKACE, "rival": DORRAGO, "contest": M100},
      focus="compare", says=[nm(GALKACE)] if place_of(M100, GALKACE) < place_of(M100, DORRAGO) else [nm(DORRAGO)],
      tags=["follow_up", "ellipsis"]),
    T("what was dorrago's time there", "competitor_result", {"competitor": DORRAGO, "contest": M100}, focus="mark",
      says=[mark_of(M100, DORRAGO)], tags=["follow_up", "partial"]),
))
ADD(CONV(
    T("hello", "greeting", {}, focus="chat", tags=["chatty"]),
    T("who won the men's 400", "podium", {"contest": M400}, focus="who", says=medal(M400, "gold"),
      tags=["exact"]),
    T("great thanks", "thanks", {}, focus="chat", tags=["chatty"]),
))
ADD(CONV(
    T("medal table", "medal_table_top", {}, focus="table", says=top(3), tags=["terse"]),
    T("just golds", "medal_table_top", {"award": "gold"}, focus="table", says=top(3, award="gold")[:1],
      tags=["follow_up", "constraint", "ellipsis"]),
    T("ok forget the golds, what did the table look like for yesterday alone", "medal_table_top",
      {"date": YESTERDAY}, focus="table", says=leaders(date=YESTERDAY),
      tags=["follow_up", "relative_day", "constraint"]),
))
ADD(CONV(
    T("how many medals does vastrelia have", "delegation_medals", {"group": "vastrelia"}, focus="count",
      says=[cnt(gmedals("vastrelia"))], tags=["exact"]),
    T("where does that put them in the table", "delegation_medals", {"group": "vastrelia"}, focus="rank",
      says=[ordinal(rank("vastrelia"))], tags=["follow_up", "pronoun"]),
    T("who's top", "medal_table_leader", {}, focus="who", says=leaders(), tags=["follow_up"]),
))
ADD(CONV(
    T("who won the men's marathon", "podium", {"contest": MMAR}, outcome="no_data", focus="who",
      tags=["no_data"]),
    T("who's leading then", "live_leader", {"contest": MMAR}, focus="who", says=at(MMAR, 1),
      tags=["follow_up", "contraction"]),
    T("what's his pace per kilometre", "none", outcome="not_covered", focus="other",
      tags=["uncovered", "pronoun"]),
    T("which country does he run for", "competitor_delegation", {"competitor": MORRESSI}, focus="group_of",
      says=[gname(PEOPLE[MORRESSI]["group"])], tags=["pronoun", "follow_up"]),
))
ADD(CONV(
    T("hey who won the womens hundred meter butterfly", "podium", {}, outcome="no_data", focus="who",
      never=medal(SW200B, "gold"), tags=["voice", "no_data", "number_words"]),
    T("sorry i meant the two hundred", "podium", {"contest": SW200B}, focus="who", says=medal(SW200B, "gold"),
      tags=["voice", "follow_up", "number_words"]),
    T("and what was her time", "competitor_result", {"competitor": pid_of(medal(SW200B, "gold")[0]),
      "contest": SW200B}, focus="mark", says=[mark_at(SW200B, 1)], tags=["voice", "pronoun"]),
))
ADD(CONV(
    T("how did big tobis team do in the final", "delegation_in_event", {"group": "zandrel", "contest": BKM},
      focus="how_did", says=["silver", placed(BKM, 2)[0]["mark"]], tags=["alias", "contraction"]),
    T("who beat them", "podium", {"contest": BKM}, focus="who", says=at(BKM, 1), tags=["pronoun", "follow_up"]),
    T("by how many points", "delegation_in_event", {"group": "zandrel", "contest": BKM}, focus="margin",
      says=[gap(BKM, 1, 2)], tags=["follow_up", "ellipsis"]),
))
_gul_next = next_of(GULELICK)
ADD(CONV(
    T("what sport is bana gulelick", "competitor_sport", {"competitor": GULELICK}, focus="sport_of",
      says=["athletics"], tags=["exact"]),
    T("when does she run next", "competitor_next", {"competitor": GULELICK}, focus="when",
      says=[hhmm(_gul_next)], tags=["pronoun", "follow_up"]),
    T("did she win her heat", "competitor_result", {"competitor": GULELICK, "contest": W100H2}, focus="whether",
      says=[mark_of(W100H2, GULELICK), ordinal(place_of(W100H2, GULELICK))], tags=["pronoun", "constraint"]),
    T("who did", "contest_place", {"contest": W100H2, "place": "1"}, focus="who", says=at(W100H2, 1),
      tags=["follow_up", "ellipsis"]),
))
ADD(CONV(
    T("what's on monday", "schedule_day", {"date": "2027-08-16"}, focus="schedule",
      says=[dname(c) for c in on_day("2027-08-16")], tags=["contraction"]),
    T("what time's the vault", "contest_time", {"contest": GWVT}, focus="when", says=[hhmm(GWVT)],
      tags=["follow_up", "contraction"]),
    T("and where", "contest_time", {"contest": GWVT}, focus="where", says=[C(GWVT)["venue"]],
      tags=["follow_up", "ellipsis"]),
))
ADD(CONV(
    T("how many medals did brellmoor win yesterday", "delegation_medals", {"group": "brellmoor", "date": YESTERDAY},
      focus="count", says=[cnt(gmedals("brellmoor", date=YESTERDAY))], tags=["relative_day", "constraint"]),
    T("and today?", "delegation_medals", {"group": "brellmoor", "date": TODAY}, focus="count",
      tags=["relative_day", "follow_up", "ellipsis"]),
))
_ath_lead = leaders(sport="athletics")
_cyc_lead = leaders(sport="cycling")
assert len(_cyc_lead) == 1
_cyc_gid = [g for g in GROUPS if gname(g) == _cyc_lead[0]][0]
ADD(CONV(
    T("who's top in athletics medals", "medal_table_leader", {"sport": "athletics"}, focus="who",
      says=_ath_lead, tags=["constraint", "contraction"]),
    T("and in cycling", "medal_table_leader", {"sport": "cycling"}, focus="who", says=_cyc_lead,
      tags=["follow_up", "ellipsis"]),
    T("how many golds have they got in cycling", "delegation_medals",
      {"group": _cyc_gid, "sport": "cycling", "award": "gold"}, focus="count",
      says=[cnt(gmedals(_cyc_gid, sport="cycling", award="gold"))], tags=["pronoun", "follow_up"]),
))
ADD(CONV(
    T("how old is tetha brelwick", "none", outcome="not_covered", focus="other", tags=["uncovered"]),
    T("ok what has she won then", "competitor_medals", {"competitor": BRELWICK}, focus="count",
      says=[cnt(comp_medals(BRELWICK))], tags=["pronoun", "follow_up"]),
    T("nice one thanks", "thanks", {}, focus="chat", tags=["chatty"]),
))
ADD(CONV(
    T("top 3 in the womens 1500", "podium", {"contest": W1500}, focus="results", says=podium(W1500),
      tags=["contraction"]),
    T("which country is the bronze medallist from", "competitor_delegation", {"competitor": DULVAIRE},
      focus="group_of", says=[gname(PEOPLE[DULVAIRE]["group"])], tags=["follow_up"]),
    T("and what did she clock", "competitor_result", {"competitor": DULVAIRE, "contest": W1500}, focus="mark",
      says=[mark_of(W1500, DULVAIRE)], tags=["pronoun", "follow_up"]),
))
ADD(CONV(
    T("who's winning the mens javelin", "live_leader", {"contest": MJAV}, focus="who", says=at(MJAV, 1),
      tags=["contraction"]),
    T("how far has he thrown", "competitor_result", {"competitor": CEDELL, "contest": MJAV}, focus="mark",
      says=[mark_of(MJAV, CEDELL)], tags=["pronoun", "follow_up"]),
    T("and who's second", "contest_place", {"contest": MJAV, "place": "2"}, focus="who", says=at(MJAV, 2),
      tags=["follow_up", "ellipsis"]),
))
ADD(CONV(
    T("whats on in gymnastics today", "schedule_day", {"date": TODAY, "sport": "gymnastics"}, focus="schedule",
      says=[dname(c) for c in on_day(TODAY, "gymnastics")], tags=["relative_day", "constraint"]),
    T("who's leading it", "live_leader", {"contest": GWAA}, focus="who", says=at(GWAA, 1),
      tags=["pronoun", "follow_up"]),
    T("by how much", "live_leader", {"contest": GWAA}, focus="margin", says=[gap(GWAA, 1, 2)],
      tags=["follow_up", "ellipsis"]),
))
_mfx = pid_of(medal(GMFX, "gold")[0])
ADD(CONV(
    T("who won the men's floor", "podium", {"contest": GMFX}, focus="who", says=medal(GMFX, "gold"),
      tags=["exact"]),
    T("what did he score", "competitor_result", {"competitor": _mfx, "contest": GMFX}, focus="mark",
      says=[mark_of(GMFX, _mfx)], tags=["pronoun", "follow_up"]),
    T("silver?", "medalist", {"contest": GMFX, "award": "silver"}, focus="who", says=medal(GMFX, "silver"),
      never=medal(GMFX, "gold"), tags=["follow_up", "ellipsis", "terse"]),
))
ADD(CONV(
    T("what was galkace's time in the 100 final", "competitor_result", {"competitor": GALKACE, "contest": M100},
      focus="mark", says=[mark_of(M100, GALKACE)], tags=["partial", "contraction"]),
    T("and in the 200?", "competitor_result", {"competitor": GALKACE, "contest": M200}, focus="mark",
      says=[mark_of(M200, GALKACE)], never=[mark_of(M100, GALKACE)], tags=["follow_up", "ellipsis"]),
    T("what about his heat", "competitor_result", {"competitor": GALKACE, "contest": M100H1}, focus="how_did",
      says=[mark_of(M100H1, GALKACE), ordinal(place_of(M100H1, GALKACE))], tags=["pronoun", "follow_up"]),
))
ADD(CONV(
    T("what can i ask you", "help", {}, focus="chat", tags=["chatty"]),
    T("ok who won the men's all around", "podium", {"contest": GMAA}, focus="who", says=medal(GMAA, "gold"),
      tags=["new_question"]),
    T("was he on the floor podium too", "competitor_result", {"competitor": ZILKEDORN, "contest": GMFX},
      focus="whether", says=res(GMFX, ZILKEDORN), tags=["pronoun", "follow_up"]),
))
ADD(CONV(
    T("who won the 200 free", "podium", {}, outcome="clarify", focus="who", tags=["ambiguous", "missing_slot"]),
    T("women's", "podium", {"contest": SW200F}, focus="who", says=medal(SW200F, "gold"),
      tags=["clarify", "follow_up"]),
    T("and silver", "medalist", {"contest": SW200F, "award": "silver"}, focus="who",
      says=medal(SW200F, "silver"), never=medal(SW200F, "gold"), tags=["follow_up", "ellipsis", "tie"]),
))
ADD(CONV(
    T("fastest 200m freestyle time so far", "best_mark", {"discipline": "swimming/200m-freestyle"}, focus="mark",
      says=[best("swimming", "200m-freestyle")[0]], tags=["exact"]),
    T("for the women", "best_mark", {"discipline": "swimming/200m-freestyle", "category": "women"}, focus="mark",
      says=[best("swimming", "200m-freestyle", "women")[0]], never=[best("swimming", "200m-freestyle", "men")[0]],
      tags=["follow_up", "constraint", "ellipsis"]),
    T("who swam it", "best_mark", {"discipline": "swimming/200m-freestyle", "category": "women"}, focus="who", says=best("swimming", "200m-freestyle", "women")[1],
      tags=["follow_up", "pronoun"]),
))
# ---- batch 4: more single questions
def women_awards(gid, award):
    return sum(1 for c in CONTESTS.values() if c["category"] == "women" for e in c["entries"]
               if e.get("award") == award and ent_group(e) == gid)


DORRESANE = pid_of("Brarren Dorresane")
ZAVINDAL = pid_of("Thindust Zavindal")
SINDAYNE = pid_of("Wanard Sindayne")
COLACE = pid_of("Tilaline Colace")
KORVACE = pid_of("Vathen Korvace")
GASSARACE = pid_of("Vonia Gassarace")
RENTENERT = pid_of("Rasaline Rentenert")
TERRDAL = pid_of("Tenora Terrdal")
SONDILLE = pid_of("Zovic Sondille")
TOLLEVANT_NEXT = next_of(TOLLEVANT)
assert TOLLEVANT_NEXT is None

ADD(T("whos teh fastest woman in the 100 so far", "best_mark", {"discipline": "athletics/100m", "category": "women"},
      focus="mark", says=[best("athletics", "100m", "women")[0]], never=[best("athletics", "100m", "men")[0]],
      tags=["misspelling", "contraction"]))
ADD(T("galkase 200m time", "competitor_result", {"competitor": GALKACE, "contest": M200}, focus="mark",
      says=[mark_of(M200, GALKACE)], tags=["misspelling", "terse"]))
ADD(T("wat place did dorresane finish in the 200", "competitor_result", {"competitor": DORRESANE, "contest": M200},
      focus="how_did", says=[ordinal(place_of(M200, DORRESANE))], tags=["misspelling", "partial"]))
ADD(T("hoo won the womens single skulls", "podium", {"contest": RW1X}, focus="who", says=medal(RW1X, "gold"),
      tags=["misspelling"]))
ADD(T("mens double scull winners", "podium", {"contest": RM2X}, focus="who", says=medal(RM2X, "gold"),
      tags=["alias", "terse"]))
ADD(T("who took bronze in the women's time trial", "medalist", {"contest": CWTT, "award": "bronze"}, focus="who",
      says=medal(CWTT, "bronze"), never=medal(CWTT, "gold"), tags=["exact"]))
ADD(T("which country won the women's road race", "podium", {"contest": CWRR}, focus="who",
      says=medal(CWRR, "gold") + [gname(PEOPLE[pid_of(medal(CWRR, "gold")[0])]["group"])], tags=["exact"]))
ADD(T("by how much did thindust zavindal win", "competitor_margin", {"competitor": ZAVINDAL}, focus="margin",
      says=[margin(RM1X, ZAVINDAL)], tags=["exact"]))
ADD(T("how much did sindayne lose by in the sculls", "competitor_margin", {"competitor": SINDAYNE, "contest": RM1X},
      focus="margin", says=[margin(RM1X, SINDAYNE), nm(ZAVINDAL)], tags=["partial"]))
ADD(T("how many medals has hothic nuvasko won", "competitor_medals", {"competitor": NUVASKO}, focus="count",
      says=[cnt(comp_medals(NUVASKO))], tags=["exact"]))
ADD(T("how many golds has quessary won in athletics", "delegation_medals",
      {"group": "quessary", "sport": "athletics", "award": "gold"}, focus="count",
      says=[cnt(gmedals("quessary", sport="athletics", award="gold"))], tags=["constraint"]))
ADD(T("whats the orrindel islanders medal tally", "delegation_medals", {"group": "orrindel"}, focus="count",
      says=[cnt(gmedals("orrindel"))], tags=["alias", "contraction"]))
ADD(T("how many silver medals does corvanthe have", "delegation_medals", {"group": "corvanthe", "award": "silver"},
      focus="count", says=[cnt(gmedals("corvanthe", award="silver"))], tags=["exact"]))
ADD(T("who's top of the gymnastics medals", "medal_table_leader", {"sport": "gymnastics"}, focus="who",
      says=leaders(sport="gymnastics"), tags=["constraint", "tie"]))
ADD(T("who are the top two in the rowing medal table", "medal_table_top", {"sport": "rowing", "count": "2"},
      focus="table", says=top(2, sport="rowing"), tags=["constraint", "number_words"]))
ADD(T("who's won the most medals in the pool", "most_medals", {"sport": "swimming"}, focus="who",
      says=most_total(sport="swimming")[0], tags=["constraint", "tie"]))
ADD(T("schedule for tuesday", "schedule_day", {"date": "2027-08-17"}, focus="schedule",
      says=[dname(c) for c in on_day("2027-08-17")], tags=["terse"]))
ADD(T("what's on sunday in the swimming", "schedule_day", {"date": TOMORROW, "sport": "swimming"}, focus="schedule",
      says=[dname(c) for c in on_day(TOMORROW, "swimming")] + [hhmm(SW400IM)], never=[hhmm(W100)],
      tags=["constraint", "contraction"]))
ADD(T("what was on yesterday", "schedule_day", {"date": YESTERDAY}, focus="schedule",
      says=sorted(set(dname(c) for c in on_day(YESTERDAY))), tags=["relative_day"]))
ADD(T("is there anything going on in athletics right now", "under_way", {"sport": "athletics"}, focus="schedule",
      says=[dname(c) for c in live("athletics")], never=["all-around"], tags=["constraint"]))
ADD(T("is anything still going on tonight", "under_way", {}, focus="status",
      says=[dname(c) for c in live()], tags=["chatty"]))
ADD(T("which medals are still being fought for right now", "under_way", {}, focus="open",
      says=[dname(c) for c in live()], tags=["chatty"]))
ADD(T("when's the womens basketball final", "contest_time", {"contest": BKW}, focus="when", says=[hhmm(BKW)],
      tags=["alias", "contraction"]))
ADD(T("what time is the mens vault on tuesday", "contest_time", {"contest": GMVT}, focus="when",
      says=[hhmm(GMVT)], tags=["constraint"]))
ADD(T("where's the rowing on monday", "contest_time", {"contest": RW2X}, focus="where",
      says=[C(RW2X)["venue"]], tags=["constraint", "contraction"]))
ADD(T("when did the men's 100m final take place", "contest_time", {"contest": M100}, focus="when",
      says=[hhmm(M100)], tags=["exact"]))
ADD(T("when does thumard zevert race next", "competitor_next", {"competitor": ZEVERT}, focus="when",
      says=[hhmm(next_of(ZEVERT))], tags=["exact"]))
ADD(T("next event for hurra brussand?", "competitor_next", {"competitor": BRUSSAND}, focus="when",
      says=[hhmm(next_of(BRUSSAND))], tags=["terse"]))
ADD(T("tilaline colace when does she jump", "competitor_next", {"competitor": COLACE}, focus="when",
      says=[hhmm(next_of(COLACE))], tags=["pronoun"]))
ADD(T("what events is zoe quillon swimming", "competitor_sport", {"competitor": QUILLON}, focus="sport_of",
      says=sorted(set(dname(C(c)) for c in contests_of(QUILLON))), tags=["diacritics"]))
ADD(T("what does emeric tollevant do", "competitor_sport", {"competitor": TOLLEVANT}, focus="sport_of",
      says=["athletics", "100 m"], tags=["diacritics"]))
ADD(T("which delegation is lucja wenderow with", "competitor_delegation", {"competitor": WENDEROW},
      focus="group_of", says=[gname(PEOPLE[WENDEROW]["group"])], tags=["diacritics"]))
ADD(T("what team is cenna dulvaire on", "competitor_delegation", {"competitor": DULVAIRE}, focus="group_of",
      says=[gname(PEOPLE[DULVAIRE]["group"])], tags=["diacritics"]))
ADD(T("hothic nuvasko so far", "competitor_profile", {"competitor": NUVASKO}, focus="profile",
      says=["gold", "bronze"], tags=["terse"]))
ADD(T("how did the double sculls go for dunmerrow", "delegation_in_event", {"group": "dunmerrow", "contest": RM2X},
      focus="how_did", says=["silver", mark_of(RM2X, "dunmerrow")], tags=["exact"]))
ADD(T("how did kalvenmark do in the men's double sculls", "delegation_in_event",
      {"group": "kalvenmark", "contest": RM2X}, focus="how_did",
      says=[ordinal(place_of(RM2X, "kalvenmark")), mark_of(RM2X, "kalvenmark")], tags=["exact"]))
ADD(T("who finished 4th in the men's basketball", "contest_place", {"contest": BKM, "place": "4"}, focus="who",
      says=at(BKM, 4), never=at(BKM, 1), tags=["exact"]))
ADD(T("full results mens 400m", "full_results", {"contest": M400}, focus="results",
      says=sum([at(M400, i) for i in range(1, 9)], []), tags=["terse", "contraction"]))
ADD(T("how are the standings in the men's high jump", "full_results", {"contest": MHJ}, focus="results",
      says=at(MHJ, 1) + at(MHJ, 2) + at(MHJ, 3), tags=["exact"]))
ADD(T("who won bronze in the women's 400", "medalist", {"contest": W400, "award": "bronze"}, focus="who",
      says=medal(W400, "bronze"), never=medal(W400, "gold"), tags=["exact"]))
ADD(T("who was fifth in the men's all around", "contest_place", {"contest": GMAA, "place": "5"}, focus="who",
      says=at(GMAA, 5), never=at(GMAA, 1), tags=["number_words"]))
ADD(T("what did sondora hervoveth jump", "competitor_result", {"competitor": HERVOVETH, "contest": WLJ},
      focus="mark", says=[mark_of(WLJ, HERVOVETH)], tags=["exact"]))
ADD(T("how did renee do in the time trial", "competitor_result", {"competitor": OSTRAVIN, "contest": CWTT},
      focus="how_did", says=res(CWTT, OSTRAVIN), tags=["partial", "diacritics"]))
ADD(T("did vonia gassarace beat rasaline rentenert", "head_to_head", {"competitor": GASSARACE, "rival": RENTENERT},
      focus="compare", says=[nm(RENTENERT)], tags=["exact"]))
ADD(T("who finished higher on the women's floor, terrdal or dovonasko", "head_to_head",
      {"competitor": TERRDAL, "rival": DOVONASKO, "contest": GWFX}, focus="compare",
      says=[nm(TERRDAL) if place_of(GWFX, TERRDAL) < place_of(GWFX, DOVONASKO) else nm(DOVONASKO)],
      tags=["partial"]))
ADD(T("did zilkedorn beat sondille on floor", "head_to_head", {"competitor": ZILKEDORN, "rival": SONDILLE,
      "contest": GMFX}, focus="compare",
      says=[nm(ZILKEDORN) if place_of(GMFX, ZILKEDORN) < place_of(GMFX, SONDILLE) else nm(SONDILLE)],
      tags=["partial"]))
ADD(T("who won the men's one hundred metre free style", "podium", {"contest": SM100F}, focus="who",
      says=medal(SM100F, "gold"), tags=["voice", "number_words"]))
ADD(T("when is annie cordvelle running next", "competitor_next", {"competitor": CORDVELLE}, focus="when",
      says=[hhmm(next_of(CORDVELLE))], tags=["voice", "mishearing"]))
ADD(T("how did zoey kwillon do in the two hundred free", "competitor_result", {"competitor": QUILLON,
      "contest": SW200F}, focus="how_did", says=res(SW200F, QUILLON), tags=["voice", "mishearing", "number_words"]))
ADD(T("what country is lucia wenderoff from", "competitor_delegation", {"competitor": WENDEROW}, focus="group_of",
      says=[gname(PEOPLE[WENDEROW]["group"])], tags=["voice", "mishearing"]))
ADD(T("how fast did the key rocket run in the two hundred", "competitor_result", {"competitor": GALKACE,
      "contest": M200}, focus="mark", says=[mark_of(M200, GALKACE)], tags=["voice", "mishearing", "alias"]))
ADD(T("did dunmerrow win the mens basket ball", "delegation_in_event", {"group": "dunmerrow", "contest": BKM},
      focus="whether", says=["gold"], tags=["voice", "mishearing"]))
ADD(T("how is team vastrelia doing", "delegation_medals", {"group": "vastrelia"}, focus="count",
      says=[cnt(gmedals("vastrelia"))], tags=["alias"]))
ADD(T("QBR medal count", "delegation_medals", {"group": "brellmoor"}, focus="count",
      says=[cnt(gmedals("brellmoor"))], tags=["abbreviation", "terse"]))
ADD(T("which gymnast has the best beam score", "best_mark", {}, outcome="no_data", focus="mark",
      never=[best("gymnastics", "floor", "women")[0]], tags=["no_data"]))
ADD(T("who won the women's 100 m hurdles", "podium", {}, outcome="no_data", focus="who",
      never=medal(W200, "gold"), tags=["no_data"]))

ADD(U("who is the youngest medallist at the games", focus="who"))
ADD(U("what's the weather like at merrin lake", focus="other"))
ADD(U("how many spectators were at greywater hall for the final", focus="count"))
ADD(U("was galkace's 100m win wind legal", focus="whether"))
ADD(U("which countries haven't won a medal yet", focus="table"))
ADD(U("what's the qualifying standard for the women's 100m final", focus="other"))
ADD(U("how many medals did kalvenmark win at the last games", focus="count",
      never=[cnt(gmedals("kalvenmark"))]))
ADD(U("show me galkace's instagram", focus="other"))
ADD(U("who's the oldest runner in the marathon", focus="who"))
ADD(U("how many laps is the men's road race", focus="other"))
ADD(U("what's the average time in the men's 100m final", focus="mark"))
ADD(U("what's a double scull", focus="other"))
ADD(U("can you ping me when the women's 100m final is done", focus="other"))
ADD(U("how many golds has kalvenmark won in women's events", focus="count", tags=["constraint"],
      never=[cnt(gmedals("kalvenmark", award="gold"))] if women_awards("kalvenmark", "gold") != gmedals("kalvenmark", award="gold") else None))
ADD(U("who was leading the men's marathon at halfway", focus="who", tags=["constraint"]))
ADD(U("how much prize money does the 100m winner get", focus="other"))
ADD(U("did galkace win more medals than zorvren", focus="compare"))
ADD(U("is bana gulelick injured", focus="other"))
ADD(U("how many events are left at these games", focus="count"))
ADD(U("how does scoring work in the all-around", focus="other"))
ADD(U("tell me a joke", outcome="not_understood", focus="other", tags=["chatty"]))
ADD(U("qwe qwe rrr", outcome="not_understood", focus="other", tags=["gibberish"]))
#@@QUESTIONS@@


def main():
    turns = []
    convs = 0
    for c in CASES:
        if "conversation" in c:
            convs += 1
            assert 2 <= len(c["conversation"]) <= 6, c
            turns += c["conversation"]
        else:
            turns.append(c)
    unc = sum(1 for t in turns if t.get("intent") == "none" or t.get("outcome") == "not_covered")
    tagc = collections.Counter()
    for c in CASES:
        tagc.update(c.get("tags", []))
    for t in turns:
        assert "focus" in t, t
        assert t.get("outcome") in ("answered", "clarify", "no_data", "not_covered", "not_understood"), t
    asks = [t["ask"] for t in turns]
    dup = [a for a, n in collections.Counter(asks).items() if n > 1]
    assert not dup, dup
    header = ("# Blind question set: scenario games (The 2027 Lowenfirth Coast Games)\n"
              "# Moment: Saturday 14 August 2027, 21:10 Europe/Lisbon (+01:00); data as of %s\n"
              "# Written by tests/eval/blind/round3/label_games.py from dataset-demo/games/*.json\n"
              "# %d turns, %d conversations, %d uncovered turns (%.1f%%)\n"
              % (SCEN["as_of"], len(turns), convs, unc, 100.0 * unc / len(turns)))
    out = os.path.join(HERE, "games.yaml")
    with open(out, "w", encoding="utf-8") as f:
        f.write(header)
        yaml.safe_dump(CASES, f, allow_unicode=True, sort_keys=False, width=1000)
    print("turns", len(turns), "conversations", convs, "cases", len(CASES),
          "uncovered %d (%.1f%%)" % (unc, 100.0 * unc / len(turns)))
    print("tags", dict(sorted(tagc.items())))


if __name__ == "__main__":
    main()
