#!/usr/bin/env python3
"""Label script for the blind question set games.yaml (scenario games, Sat 14 Aug 2027 21:10).

Every expected fact is computed from dataset-demo/games/*.json; the questions and their
intended meaning (intent, slots, focus) are written as data below."""
import json, os, collections
DATA = "/work/main/dataset-demo/games"
def _load(n): return json.load(open(os.path.join(DATA, n), encoding="utf-8"))
CONTESTS = _load("contests.json"); PEOPLE = _load("competitors.json")
GROUPS = _load("groups.json"); SPORTS = _load("sports.json"); SCEN = _load("scenario.json")
C = {c["id"]: c for c in CONTESTS}; P = {p["id"]: p for p in PEOPLE}; G = {g["id"]: g for g in GROUPS}
S = {s["id"]: s for s in SPORTS}
CLOCK = SCEN["clock"][:16]  # local time, 2027-08-14T21:10
TODAY = CLOCK[:10]
WORDS = "zero one two three four five six seven eight nine".split()
def cnt(n): return WORDS[n] if 0 <= n < 10 else str(n)
def ordw(n): return f"{n}{'th' if 10 <= n % 100 <= 20 else {1:'st',2:'nd',3:'rd'}.get(n % 10, 'th')}"
def N(pid): return f"{P[pid]['given']} {P[pid]['family']}"
def GN(gid): return G[gid]["name"]
def DN(sport, disc):
    return next(d["name"] for d in S[sport]["disciplines"] if d["id"] == disc)
def ename(e): return N(e["competitor"]) if "competitor" in e else GN(e["group"])
def secs(m):
    parts = [float(x) for x in m.split(":")]
    t = 0.0
    for x in parts: t = t * 60 + x
    return t
def fmt_time(t, nd=2):
    if t < 60: return f"{t:.{nd}f} s".replace(".00 s", " s") if nd == 0 else f"{t:.{nd}f} s"
    h, r = divmod(t, 3600); mnt, s = divmod(r, 60)
    if h: return f"{int(h)}:{int(mnt):02d}:{int(round(s)):02d}"
    return f"{int(mnt)}:{s:0{3+nd}.{nd}f}"
def fmt(cid, mark):
    m = C[cid]["measure"]
    if m == "time":
        if ":" in mark: return mark
        return fmt_time(float(mark)) if float(mark) >= 60 else f"{mark} s"  # "60.00" is written 1:00.00
    if m == "distance": return f"{mark} m"
    return mark
def ents(cid): return C[cid].get("entries", [])
def placed(cid): return sorted([e for e in ents(cid) if "place" in e], key=lambda e: e["place"])
def members(e): return [e["competitor"]] if "competitor" in e else e.get("members", [])
def entry(pid, cid):
    for e in ents(cid):
        if pid in members(e): return e
def gentry(gid, cid):
    out = [e for e in ents(cid) if ("group" in e and e["group"] == gid) or ("competitor" in e and P[e["competitor"]]["group"] == gid)]
    return out
def at_place(cid, n): return [ename(e) for e in placed(cid) if e["place"] == n]
def medalists(cid, award): return [ename(e) for e in ents(cid) if e.get("award") == award]
def podium(cid): return [ename(e) for e in ents(cid) if e.get("award")]
def top(cid, n): return [ename(e) for e in placed(cid)[:n]]
def marks_top(cid, n): return [fmt(cid, e["mark"]) for e in placed(cid)[:n]]
def gap(cid, a, b):
    """a-b gap between two marks, formatted"""
    m = C[cid]["measure"]
    if m == "time":
        d = abs(secs(a) - secs(b)); nd = 0 if (":" in a and a.count(":") == 2) else 2
        return fmt_time(d, nd) if d < 60 else fmt_time(d, nd)
    d = abs(float(a) - float(b)); nd = max(len(a.split(".")[-1]) if "." in a else 0, len(b.split(".")[-1]) if "." in b else 0)
    v = f"{d:.{nd}f}"
    return f"{v} m" if m == "distance" else v
def date_of(cid): return C[cid]["start"][:10]
def time_of(cid): return C[cid]["start"][11:16]
def venue(cid): return C[cid].get("venue")
def comp_contests(pid): return sorted([c["id"] for c in CONTESTS if entry(pid, c["id"])], key=lambda x: C[x]["start"])
def comp_medals(pid, award=None):
    return [(cid, entry(pid, cid)["award"]) for cid in comp_contests(pid)
            if entry(pid, cid).get("award") and (award is None or entry(pid, cid)["award"] == award)]
def next_contest(pid):
    fut = [cid for cid in comp_contests(pid) if C[cid]["status"] == "scheduled"]
    return fut[0] if fut else None
def winner_entry(cid): return placed(cid)[0]
def margin(pid, cid):
    e = entry(pid, cid); pl = placed(cid)
    if e["place"] == 1:
        other = [x for x in pl if x["place"] > 1][0]
        return ename(other), gap(cid, e["mark"], other["mark"])
    w = pl[0]
    return ename(w), gap(cid, e["mark"], w["mark"])
def medal_table(sport=None, date=None, award=None):
    t = collections.defaultdict(lambda: {"gold": 0, "silver": 0, "bronze": 0})
    for c in CONTESTS:
        if sport and c["sport"] != sport: continue
        if date and c["start"][:10] != date: continue
        for e in c.get("entries", []):
            a = e.get("award")
            if not a: continue
            gid = e["group"] if "group" in e else P[e["competitor"]]["group"]
            t[gid][a] += 1
    rows = []
    for gid, d in t.items():
        d = dict(d); d["total"] = d["gold"] + d["silver"] + d["bronze"]; d["id"] = gid
        rows.append(d)
    if award: key = lambda r: (-r[award],)
    else: key = lambda r: (-r["gold"], -r["silver"], -r["bronze"])
    rows = [r for r in rows if (r[award] if award else r["total"]) > 0]
    rows.sort(key=lambda r: key(r) + (GN(r["id"]),))
    for i, r in enumerate(rows):
        r["rank"] = next(j for j, q in enumerate(rows) if key(q) == key(r)) + 1
    return rows
def table_leaders(**kw):
    rows = medal_table(**kw); return [GN(r["id"]) for r in rows if r["rank"] == 1]
def most_medals(**kw):
    rows = medal_table(**kw); k = kw.get("award") or "total"
    if not rows: return []
    mx = max(r[k] for r in rows); return [GN(r["id"]) for r in rows if r[k] == mx], mx
def grow(gid, **kw):
    for r in medal_table(**kw):
        if r["id"] == gid: return r
    return {"gold": 0, "silver": 0, "bronze": 0, "total": 0, "rank": None, "id": gid}
def contests_on(date, sport=None):
    return sorted([c["id"] for c in CONTESTS if c["start"][:10] == date and (not sport or c["sport"] == sport)], key=lambda x: C[x]["start"])
def live(sport=None): return [c["id"] for c in CONTESTS if c["status"] == "live" and (not sport or c["sport"] == sport)]
def best_mark(sport, disc, category=None, rnd=None):
    best = None
    for c in CONTESTS:
        if c["sport"] != sport or c["discipline"] != disc: continue
        if category and c["category"] != category: continue
        if rnd and not c["phase"].startswith(rnd): continue
        for e in c.get("entries", []):
            if "mark" not in e or e.get("status"): continue
            v = secs(e["mark"]) if c["measure"] == "time" else float(e["mark"])
            better = best is None or (v < best[0] if c["measure"] == "time" else v > best[0])
            if better: best = (v, c["id"], e)
    return best[1], ename(best[2]), fmt(best[1], best[2]["mark"])
def best_mark_all(sport, disc, category=None, rnd=None):
    """the best mark and every entrant who holds it (ties)"""
    cid, _, mk = best_mark(sport, disc, category, rnd)
    names = []
    for c in CONTESTS:
        if c["sport"] != sport or c["discipline"] != disc: continue
        if category and c["category"] != category: continue
        if rnd and not c["phase"].startswith(rnd): continue
        for e in c.get("entries", []):
            if "mark" in e and not e.get("status") and fmt(c["id"], e["mark"]) == mk: names.append(ename(e))
    return mk, names

# ---------------------------------------------------------------- the set
def T(ask, intent, focus, slots=None, outcome="answered", says=(), never=(), tags=()):
    t = {"ask": ask, "intent": intent}
    if intent != "none":
        t["slots"] = dict(slots or {})
    t["outcome"] = outcome
    t["focus"] = focus
    if says: t["says"] = list(says)
    if never: t["never"] = list(never)
    if tags: t["tags"] = list(tags)
    return t
def U(ask, focus="other", never=(), tags=()):
    """a question no intent on the card answers, or about something the data does not hold"""
    return T(ask, "none", focus, outcome="not_covered", never=never, tags=list(tags) + ["uncovered"])
def ND(ask, intent, focus, slots=None, never=(), tags=(), uncovered=True):
    """covered, but the data has nothing to give"""
    return T(ask, intent, focus, slots, outcome="no_data", never=never,
             tags=list(tags) + (["uncovered"] if uncovered else []))
CASES = []
def one(t, tags=()):
    t = dict(t); t["tags"] = sorted(set(t.get("tags", [])) | set(tags)); CASES.append(t)
def conv(*turns, tags=()):
    CASES.append({"conversation": list(turns), "tags": sorted(set(tags) | {x for t in turns for x in t.get("tags", [])})})

def R(pid, cid):
    e = entry(pid, cid); out = []
    if "place" in e: out.append(ordw(e["place"]))
    if "mark" in e: out.append(fmt(cid, e["mark"]))
    return out
def GR(gid, cid):
    out = []
    for e in gentry(gid, cid):
        if "competitor" in e: out.append(ename(e))
        if "place" in e: out.append(ordw(e["place"]))
        if "mark" in e: out.append(fmt(cid, e["mark"]))
    return out
def MED(pid, award=None): return cnt(len(comp_medals(pid, award)))
def GM(gid, **kw): r = grow(gid, **kw); k = kw.get("award") or "total"; return cnt(r[k])
def RANK(gid, **kw): return ordw(grow(gid, **kw)["rank"])
def TOPN(n, **kw):
    """the top n of the table; asserts no tie straddles place n, so the n names are certain"""
    rows = medal_table(**kw)
    assert len(rows) <= n or rows[n]["rank"] == n + 1, ("tie at the cut", kw)
    return [GN(r["id"]) for r in rows[:n]]
def SAFE_TOP(n, **kw):
    """names certain to be in a top n: every row whose whole tie group fits within n"""
    rows = medal_table(**kw)
    return [GN(r["id"]) for r in rows if sum(1 for q in rows if q["rank"] <= r["rank"]) <= n]
def WHEN(cid): return [x for x in (time_of(cid), venue(cid)) if x]
def SCHED(date, sport=None): return [time_of(c) for c in contests_on(date, sport)]
def LEAD(cid):
    pl = placed(cid); return [ename(pl[0]), gap(cid, pl[0]["mark"], pl[1]["mark"])]
def AHEAD(a, b, cid):
    ea, eb = entry(a, cid), entry(b, cid)
    return (N(a), N(b)) if ea["place"] < eb["place"] else (N(b), N(a))
def DISC(pid): return sorted({DN(C[c]["sport"], C[c]["discipline"]) for c in comp_contests(pid)})
def SPORT(pid): return S[P[pid]["sport"]]["name"]
def MARGIN(pid, cid): return list(margin(pid, cid))
def ZOES(): return [N(p["id"]) for p in PEOPLE if p["given"] == "Zoë"]
def FAMILY(f): return [N(p["id"]) for p in PEOPLE if p["family"] == f]
def PROFILE(pid): return [fmt(c, entry(pid, c)["mark"]) for c in comp_contests(pid) if "mark" in entry(pid, c)]

D_TODAY, D_TOM, D_YEST = "2027-08-14", "2027-08-15", "2027-08-13"
M100, W100 = "ath-m-100m-final", "ath-w-100m-final"
MAR = "ath-m-marathon-final"; JAV = "ath-m-javelin-final"; HJ = "ath-m-high-jump-final"
WAA = "gym-w-all-around-final"; WLJ = "ath-w-long-jump-final"

# 1 parent following the marathon on the bus home
conv(
    T("whos out in front in the mens marathon right now", "live_leader", "who", {"contest": MAR}, says=[LEAD(MAR)[0]], tags=["contraction", "constraint"]),
    T("by how much", "live_leader", "margin", {"contest": MAR}, says=LEAD(MAR), tags=["follow_up", "ellipsis"]),
    T("and who's running third", "contest_place", "who", {"contest": MAR, "place": "3"}, says=at_place(MAR, 3), tags=["follow_up", "ellipsis"]),
    T("anyone from welkmarsh near the front?", "delegation_in_event", "how_did", {"group": "welkmarsh", "contest": MAR}, says=GR("welkmarsh", MAR), tags=["follow_up"]),
    T("brilliant thank you", "thanks", "chat", {}, tags=["thanks_between"]),
    T("oh and when's the women's 100m final", "contest_time", "when", {"contest": W100}, says=WHEN(W100), tags=["new_question", "contraction"]),
    tags=["chatty"])

# 2 single, relative day
one(T("who won the 100 metres last night", "podium", "who", {"contest": M100}, says=medalists(M100, "gold"), tags=["relative_day"]))

# 3 three Zoës
conv(
    T("how is zoe getting on at the games", "competitor_profile", "profile", {}, outcome="clarify", says=ZOES(), tags=["ambiguous", "partial", "diacritics", "clarify"]),
    T("the swimmer", "competitor_profile", "profile", {"competitor": "p196"}, says=PROFILE("p196"), tags=["follow_up"]),
    T("so how many medals is that", "competitor_medals", "count", {"competitor": "p196"}, says=[MED("p196")], tags=["follow_up", "pronoun"]),
    T("any of them gold?", "competitor_medals", "whether", {"competitor": "p196", "award": "gold"}, tags=["follow_up", "pronoun"]),
    T("when does she swim next", "competitor_next", "when", {"competitor": "p196"}, says=[time_of(next_contest("p196"))], tags=["follow_up", "pronoun"]),
    T("and who does she swim for", "competitor_delegation", "group_of", {"competitor": "p196"}, says=[GN(P["p196"]["group"])], tags=["follow_up", "pronoun"]))

# 4 journalist checking the table
conv(
    T("Medal table, top five please.", "medal_table_top", "table", {"count": "5"}, says=TOPN(5), tags=["number_words"]),
    T("Who tops it in the pool?", "medal_table_leader", "who", {"sport": "swimming"}, says=table_leaders(sport="swimming"), tags=["follow_up", "constraint"]),
    T("And in track and field?", "medal_table_leader", "who", {"sport": "athletics"}, says=table_leaders(sport="athletics"), tags=["follow_up", "ellipsis", "constraint"]),
    T("How many golds does Quessary have?", "delegation_medals", "count", {"group": "quessary", "award": "gold"}, says=[GM("quessary", award="gold")], tags=["exact"]),
    T("Where does that put them overall?", "delegation_medals", "rank", {"group": "quessary"}, says=[RANK("quessary")], tags=["follow_up", "pronoun"]),
    tags=["journalist"])

# 5 uncovered: record
one(U("whats the world record for the mens 100m", "mark", never=[fmt(M100, winner_entry(M100)["mark"])]))

# 6 commuter, long jump
conv(
    T("who took gold in the womens long jump", "medalist", "who", {"contest": WLJ, "award": "gold"}, says=medalists(WLJ, "gold"), tags=["constraint"]),
    T("how far did she jump", "competitor_result", "mark", {"competitor": "p166", "contest": WLJ}, says=[fmt(WLJ, entry("p166", WLJ)["mark"])], tags=["follow_up", "pronoun"]),
    T("and how close was the silver medallist", "competitor_margin", "margin", {"competitor": "p161", "contest": WLJ}, says=[margin("p161", WLJ)[1]], tags=["follow_up"]),
    T("who was fourth", "contest_place", "who", {"contest": WLJ, "place": "4"}, says=at_place(WLJ, 4), tags=["follow_up", "ellipsis"]))

# 7 voice, javelin still live
conv(
    T("who one the men's jabberlin", "podium", "who", {"contest": JAV}, outcome="no_data", tags=["voice", "mishearing"]),
    T("ok so whos leading it then", "live_leader", "who", {"contest": JAV}, says=LEAD(JAV), tags=["follow_up", "pronoun", "voice"]),
    T("how far has the guy in second thrown", "contest_place", "mark", {"contest": JAV, "place": "2"}, says=[fmt(JAV, placed(JAV)[1]["mark"])], tags=["follow_up"]),
    tags=["voice"])

# 8 shared family name
conv(
    T("how did kovendal do", "competitor_profile", "profile", {}, outcome="clarify", says=FAMILY("Kovendal"), tags=["ambiguous", "partial", "clarify"]),
    T("the rower not the swimmer", "competitor_profile", "profile", {"competitor": "p084"}, says=PROFILE("p084"), tags=["follow_up"]),
    T("what place was that", "competitor_result", "how_did", {"competitor": "p084", "contest": "row-m-single-sculls-final"}, says=[R("p084", "row-m-single-sculls-final")[0]], tags=["follow_up", "pronoun"]))

# 9 a fan's questions the data cannot answer
conv(
    T("how old is wonorin galkace", "none", "other", outcome="not_covered", tags=["uncovered", "exact"]),
    U("is he the one they call the quay rocket or is that someone else", "other", tags=["pronoun"]),
    T("ok how many medals has he got", "competitor_medals", "count", {"competitor": "p005"}, says=[MED("p005")], tags=["follow_up", "pronoun"]),
    U("and whos his coach", "other", tags=["follow_up", "pronoun"]),
    tags=["fan"])

# 10 head to head across rounds
conv(
    T("did dorrago beat galkace in the heats", "head_to_head", "compare", {"competitor": "p013", "rival": "p005", "contest": "ath-m-100m-heat-1"}, says=[AHEAD("p013", "p005", "ath-m-100m-heat-1")[0]], tags=["constraint", "partial"]),
    T("what about in the final", "head_to_head", "compare", {"competitor": "p013", "rival": "p005", "contest": M100}, says=[AHEAD("p013", "p005", M100)[0]], tags=["follow_up", "ellipsis"]),
    T("and the 200", "head_to_head", "compare", {"competitor": "p013", "rival": "p005", "contest": "ath-m-200m-final"}, says=[AHEAD("p013", "p005", "ath-m-200m-final")[0]], tags=["follow_up", "ellipsis"]),
    T("by how much did galkace win that one", "competitor_margin", "margin", {"competitor": "p005", "contest": "ath-m-200m-final"}, says=MARGIN("p005", "ath-m-200m-final"), tags=["follow_up", "pronoun"]))

# 11 best marks with restrictions
bm = best_mark_all("athletics", "100m"); bw = best_mark_all("athletics", "100m", "women"); bh = best_mark_all("athletics", "100m", "men", "heat")
conv(
    T("fastest hundred metres time so far?", "best_mark", "mark", {"discipline": "athletics/100m"}, says=[bm[0]] + bm[1], tags=["chatty"]),
    T("and the women", "best_mark", "mark", {"discipline": "athletics/100m", "category": "women"}, says=[bw[0]] + bw[1], tags=["follow_up", "ellipsis", "constraint"]),
    T("men again but only counting the heats", "best_mark", "mark", {"discipline": "athletics/100m", "category": "men", "round": "heat"}, says=[bh[0]] + bh[1], tags=["follow_up", "constraint"]))

# 12 schedule planning for a family day out
conv(
    T("what's on tomorrow", "schedule_day", "schedule", {"date": D_TOM}, says=SCHED(D_TOM), tags=["relative_day", "contraction"]),
    T("anything in the pool", "schedule_day", "schedule", {"date": D_TOM, "sport": "swimming"}, says=SCHED(D_TOM, "swimming"), tags=["follow_up", "constraint"]),
    T("what about monday", "schedule_day", "schedule", {"date": "2027-08-16"}, says=SCHED("2027-08-16"), tags=["follow_up", "ellipsis"]),
    T("any rowing that day", "schedule_day", "schedule", {"date": "2027-08-16", "sport": "rowing"}, says=SCHED("2027-08-16", "rowing"), tags=["follow_up", "constraint"]),
    U("can you still get tickets for the regatta", "other", tags=["follow_up"]),
    tags=["parent"])

# 13 what's happening now
conv(
    T("whats going on right now", "under_way", "schedule", {}, says=sorted({DN(C[c]["sport"], C[c]["discipline"]) for c in live()}), tags=["chatty"]),
    T("any gymnastics on?", "under_way", "schedule", {"sport": "gymnastics"}, says=[DN("gymnastics", C[c]["discipline"]) for c in live("gymnastics")], tags=["follow_up", "constraint"]),
    T("who's winning that", "live_leader", "who", {"contest": WAA}, says=[LEAD(WAA)[0]], tags=["follow_up", "pronoun"]),
    U("what has she scored on each apparatus", "mark", tags=["follow_up", "pronoun"]))

# 14 double sculls
DS = "row-m-double-sculls-final"
conv(
    T("how did brellmoor get on in the men's double sculls", "delegation_in_event", "how_did", {"group": "brellmoor", "contest": DS}, says=GR("brellmoor", DS), tags=["constraint"]),
    U("who were the two guys in the boat", "other", tags=["follow_up"]),
    T("who came second", "contest_place", "who", {"contest": DS, "place": "2"}, says=at_place(DS, 2), tags=["follow_up", "ellipsis"]))

# 15 Big Tobi
BK = "bkb-m-tournament-final"
conv(
    T("has big tobi won a medal", "competitor_medals", "whether", {"competitor": "p253"}, says=[comp_medals("p253")[0][1]], tags=["partial", "chatty"]),
    T("which team is he on", "competitor_delegation", "group_of", {"competitor": "p253"}, says=[GN("zandrel")], tags=["follow_up", "pronoun"]),
    T("what was the score in the final", "full_results", "results", {"contest": BK}, says=[fmt(BK, e["mark"]) for e in placed(BK)[:2]], tags=["follow_up"]),
    U("how many points did he score himself", "mark", tags=["follow_up", "pronoun"]),
    tags=["fan"])

# 16 single: delegation total
one(T("how many medals has kalvenmark got", "delegation_medals", "count", {"group": "kalvenmark"}, says=[GM("kalvenmark")], tags=["exact"]))

# 17 single: most medals (by total, not the table leader)
mm = most_medals()
one(T("Which country has won the most medals altogether?", "most_medals", "who", {}, says=mm[0] + [str(mm[1]) if mm[1] >= 10 else cnt(mm[1])], tags=["exact"]))

# 18 table leader, then yesterday
conv(
    T("who's top of the medal table", "medal_table_leader", "who", {}, says=table_leaders(), tags=["contraction"]),
    T("how many golds", "delegation_medals", "count", {"group": "kalvenmark", "award": "gold"}, says=[GM("kalvenmark", award="gold")], tags=["follow_up", "ellipsis"]),
    T("and who topped it just for yesterday", "medal_table_leader", "who", {"date": D_YEST}, says=table_leaders(date=D_YEST), tags=["relative_day", "constraint", "follow_up"]),
    T("how many did they win yesterday", "delegation_medals", "count", {"group": "orrindel", "date": D_YEST}, says=[GM("orrindel", date=D_YEST)], tags=["follow_up", "pronoun", "relative_day"]))

# 19 a category restriction no intent takes
wt = collections.Counter()
for c in CONTESTS:
    if c["category"] == "women":
        for e in c.get("entries", []):
            if e.get("award") == "gold": wt[e["group"] if "group" in e else P[e["competitor"]]["group"]] += 1
conv(
    U("show me the medal table for women's events only", "table", tags=["constraint"]),
    T("ok just the overall one then, top 3", "medal_table_top", "table", {"count": "3"}, says=TOPN(3), tags=["follow_up", "number_words"]))

# 20 single, date restriction on an athlete's medals
one(U("how many medals did galkace win yesterday", "count", tags=["relative_day", "constraint", "partial"]))

# 21 cycling double
TT, RR = "cyc-w-time-trial-final", "cyc-w-road-race-final"
conv(
    T("who won the womens time trial", "podium", "who", {"contest": TT}, says=medalists(TT, "gold"), tags=["constraint"]),
    T("didnt she win the road race as well", "competitor_result", "whether", {"competitor": "p210", "contest": RR}, says=[R("p210", RR)[0]], tags=["follow_up", "pronoun"]),
    T("so how many golds is that for her", "competitor_medals", "count", {"competitor": "p210", "award": "gold"}, says=[MED("p210", "gold")], tags=["follow_up", "pronoun"]),
    T("where was the time trial held", "contest_time", "where", {"contest": TT}, says=[venue(TT)], tags=["follow_up"]),
    ND("and the road race, where was that", "contest_time", "where", {"contest": RR}, tags=["follow_up", "ellipsis"]),
    tags=["cycling_fan"])

# 22 sport of a name with apostrophe
conv(
    T("what does rhea maud ocarrowin compete in", "competitor_sport", "sport_of", {"competitor": "p159"}, says=[SPORT("p159")] + DISC("p159"), tags=["misspelling"]),
    T("hows she done", "competitor_result", "how_did", {"competitor": "p159", "contest": WLJ}, says=R("p159", WLJ), tags=["follow_up", "pronoun", "contraction"]),
    T("who won it then", "podium", "who", {"contest": WLJ}, says=medalists(WLJ, "gold"), tags=["follow_up", "pronoun"]))

# 23 voice 1500
M15 = "ath-m-1500m-final"
conv(
    T("who won the men's fifteen hundred", "podium", "who", {"contest": M15}, says=medalists(M15, "gold"), tags=["voice", "number_words"]),
    T("what was thorust fuss wicks time", "competitor_result", "mark", {"competitor": "p030", "contest": M15}, says=[R("p030", M15)[1]], tags=["voice", "mishearing", "follow_up"]),
    T("how far back was the runner up", "competitor_margin", "margin", {"competitor": "p032", "contest": M15}, says=[margin("p032", M15)[1]], tags=["voice", "follow_up"]),
    tags=["voice"])

# 24 heats
H2 = "ath-m-100m-heat-2"
conv(
    T("who won heat 2 of the mens 100", "contest_place", "who", {"contest": H2, "place": "1"}, says=at_place(H2, 1), tags=["constraint"]),
    T("full results please", "full_results", "results", {"contest": H2}, says=[ename(e) for e in placed(H2)], tags=["follow_up", "ellipsis"]),
    T("actually just the top three", "full_results", "results", {"contest": H2, "count": "3"}, says=top(H2, 3), never=[ename(placed(H2)[7])], tags=["follow_up", "number_words"]),
    U("which of them had the best reaction time", "mark", tags=["follow_up"]))

# 25 diacritics dropped
conv(
    T("how did lucja wenderow do", "competitor_result", "how_did", {"competitor": "p175"}, says=R("p175", "ath-w-javelin-final"), tags=["diacritics"]),
    T("is that a games record", "none", "other", outcome="not_covered", tags=["uncovered", "follow_up", "pronoun"]),
    T("where's inigo saltreva in the marathon", "competitor_result", "how_did", {"competitor": "p035", "contest": MAR}, says=R("p035", MAR), tags=["diacritics", "new_question"]))

# 26 margins
one(T("who beat dosavorn in the 100 final and by how much", "competitor_margin", "margin", {"competitor": "p001", "contest": M100}, says=MARGIN("p001", M100), tags=["partial"]))

# 27 men's 400 IM (no entries yet)
IM = "swm-m-400m-individual-medley-final"
conv(
    U("whos swimming in the mens 400 im", "other"),
    T("well when is it", "contest_time", "when", {"contest": IM}, says=WHEN(IM), tags=["follow_up", "pronoun"]))

# 28 events the data does not have
one(ND("who won the men's pole vault", "podium", "who", {}, never=[LEAD(HJ)[0]]))
one(ND("results of the women's 100m backstroke?", "full_results", "results", {}, never=medalists("swm-w-100m-breaststroke-final", "gold")))

# 29 an athlete with nothing on
conv(
    T("when is orena nenderoy competing", "competitor_next", "when", {"competitor": "p222"}, outcome="no_data", tags=["exact"]),
    T("what's her sport", "competitor_sport", "sport_of", {"competitor": "p222"}, says=[SPORT("p222")], tags=["follow_up", "pronoun"]))

# 30 predictions
conv(
    T("who's the favourite for the women's 100 tomorrow", "none", "who", outcome="not_covered", tags=["uncovered", "relative_day"]),
    T("what time is it on", "contest_time", "when", {"contest": W100}, says=[time_of(W100)], tags=["follow_up", "pronoun"]),
    T("who's fastest in the heats", "best_mark", "mark", {"discipline": "athletics/100m", "category": "women", "round": "heat"}, says=[best_mark_all("athletics", "100m", "women", "heat")[0]] + best_mark_all("athletics", "100m", "women", "heat")[1], tags=["follow_up", "constraint"]))

# 31 javelin standings as such
one(T("current standings mens javelin", "full_results", "results", {"contest": JAV}, says=top(JAV, 8), tags=["constraint"]))

# 32 last place
one(T("who finished last in the women's road race", "contest_place", "who", {"contest": RR, "place": str(placed(RR)[-1]["place"])}, says=[ename(placed(RR)[-1])], tags=["constraint"]))

# 33 tied silver
F2 = "swm-w-200m-freestyle-final"
conv(
    T("who got silver in the 200 free women", "medalist", "who", {"contest": F2, "award": "silver"}, says=medalists(F2, "silver"), tags=["constraint"]),
    T("wait two of them?? what were their times", "full_results", "mark", {"contest": F2}, says=[fmt(F2, e["mark"]) for e in placed(F2) if e.get("award") == "silver"][:1], tags=["follow_up", "chatty"]),
    T("who won it", "podium", "who", {"contest": F2}, says=medalists(F2, "gold"), tags=["follow_up", "pronoun"]))

# 34 rank in the table
one(T("where's halvorne in the medal standings", "delegation_medals", "rank", {"group": "halvorne"}, says=[RANK("halvorne")], tags=["contraction"]))

# 35 today's medals for a delegation
one(T("did dunmerrow win anything today", "delegation_medals", "count", {"group": "dunmerrow", "date": D_TODAY}, says=[GM("dunmerrow", date=D_TODAY)], tags=["relative_day"]))

# 36 silvers in a sport
one(T("how many swimming silvers for vastrelia", "delegation_medals", "count", {"group": "vastrelia", "sport": "swimming", "award": "silver"}, says=[GM("vastrelia", sport="swimming", award="silver")], tags=["constraint"]))

# 37 gymnastics table top
one(T("top 3 countries in gymnastics medals", "medal_table_top", "table", {"sport": "gymnastics", "count": "3"}, says=TOPN(3, sport="gymnastics"), tags=["constraint"]))

# 38 most bronzes
mb = most_medals(award="bronze")
one(T("which team has the most bronzes", "most_medals", "who", {"award": "bronze"}, says=mb[0], tags=["constraint"]))

# 39 help then greeting-first conversation
conv(
    T("hello", "greeting", "chat", {}),
    T("what kind of stuff can i ask you", "help", "chat", {}),
    T("ok who won the men's floor", "podium", "who", {"contest": "gym-m-floor-final"}, says=medalists("gym-m-floor-final", "gold"), tags=["new_question", "constraint"]),
    T("and silver", "medalist", "who", {"contest": "gym-m-floor-final", "award": "silver"}, says=medalists("gym-m-floor-final", "silver"), tags=["follow_up", "ellipsis"]))

# 40 chatty parent, gymnastics
GF = "gym-w-floor-final"
conv(
    T("my daughter is obsessed with gymnastics, who won the women's floor?", "podium", "results", {"contest": GF}, says=podium(GF), tags=["chatty", "constraint"]),
    T("what did the winner score", "competitor_result", "mark", {"competitor": "p229", "contest": GF}, says=[fmt(GF, entry("p229", GF)["mark"])], tags=["follow_up"]),
    T("how's she doing in the all around tonight", "competitor_result", "how_did", {"competitor": "p229", "contest": WAA}, says=R("p229", WAA), tags=["follow_up", "pronoun"]),
    T("who's ahead of her", "live_leader", "who", {"contest": WAA}, says=[LEAD(WAA)[0]], tags=["follow_up", "pronoun"]),
    T("thanks so much!!", "thanks", "chat", {}, tags=["thanks_between"]),
    U("is there a signing session with the gymnasts after", "other"),
    tags=["parent", "chatty"])

# 41 sport of, medals
conv(
    T("what sport is hanel zilkedorn in", "competitor_sport", "sport_of", {"competitor": "p114"}, says=[SPORT("p114")], tags=["exact"]),
    T("medals?", "competitor_medals", "count", {"competitor": "p114"}, says=[MED("p114")], tags=["follow_up", "ellipsis"]),
    T("how did he do in the floor", "competitor_result", "how_did", {"competitor": "p114", "contest": "gym-m-floor-final"}, says=R("p114", "gym-m-floor-final"), tags=["follow_up", "pronoun", "constraint"]))

# 42 yes/no medal
W400 = "ath-w-400m-final"
one(T("did krasira drolermont get a medal in the 400", "competitor_result", "whether", {"competitor": "p133", "contest": W400}, says=[entry("p133", W400)["award"]], tags=["exact"]))

# 43 somebody not at these games
one(ND("how did usain bolt do", "competitor_result", "how_did", {}, tags=["exact"]))

# 44 women's basketball final
BW = "bkb-w-tournament-final"
conv(
    T("when's the women's gold medal game", "contest_time", "when", {"contest": BW}, says=WHEN(BW), tags=["contraction"]),
    U("which teams are playing in it", "other", tags=["follow_up", "pronoun"]),
    U("what channel is it on", "other", tags=["follow_up", "pronoun"]),
    T("who won the men's one", "podium", "who", {"contest": BK}, says=medalists(BK, "gold"), tags=["follow_up", "ellipsis"]))

# 45 alias of a contest
one(T("full results from the men's sprint final", "full_results", "results", {"contest": M100}, says=[ename(e) for e in placed(M100)], tags=["partial"]))

# 46 women's high jump
WHJ = "ath-w-high-jump-final"
one(T("what time does the women's high jump start on monday", "contest_time", "when", {"contest": WHJ}, says=[time_of(WHJ)], tags=["constraint"]))

# 47 change of subject and back
SS = "row-m-single-sculls-final"
conv(
    T("who won the mens single sculls", "podium", "who", {"contest": SS}, says=medalists(SS, "gold"), tags=["constraint"]),
    T("by how much", "competitor_margin", "margin", {"competitor": "p088", "contest": SS}, says=MARGIN("p088", SS), tags=["follow_up", "ellipsis"]),
    T("random but what's on tomorrow", "schedule_day", "schedule", {"date": D_TOM}, says=SCHED(D_TOM), tags=["new_question", "relative_day"]),
    T("back to the rowing - who got bronze", "medalist", "who", {"contest": SS, "award": "bronze"}, says=medalists(SS, "bronze"), tags=["follow_up"]),
    T("cheers", "thanks", "chat", {}, tags=["thanks_between"]))

# 48 category restriction on a delegation
one(U("how many medals have kalvenmark's women won", "count", tags=["constraint"]))

# 49 delegation leading live
one(U("is anyone from pellavia leading an event right now", "whether"))

# 50 best long jump
LJ_all = best_mark_all("athletics", "long-jump"); LJ_w = best_mark_all("athletics", "long-jump", "women")
conv(
    T("best long jump of the games so far", "best_mark", "mark", {"discipline": "athletics/long-jump"}, says=[LJ_all[0]] + LJ_all[1]),
    T("womens only", "best_mark", "mark", {"discipline": "athletics/long-jump", "category": "women"}, says=[LJ_w[0]] + LJ_w[1], tags=["follow_up", "constraint"]),
    U("what was the wind", "other", tags=["follow_up"]))

# 51 fastest in the 100 free
F1 = best_mark_all("swimming", "100m-freestyle")
one(T("quickest 100 free time at these games", "best_mark", "mark", {"discipline": "swimming/100m-freestyle"}, says=[F1[0]] + F1[1], tags=["partial"]))

# 52 games-wide facts nobody holds
conv(
    U("how many athletes are at the games", "count"),
    U("and how many countries", "count", tags=["follow_up", "ellipsis"]),
    T("ok then how many medals has orrindel won", "delegation_medals", "count", {"group": "orrindel"}, says=[GM("orrindel")], tags=["new_question", "partial"]))

# 53 what is still open
one(U("which events are still to be decided", "open"))

# 54 named day
one(T("what was on thursday", "schedule_day", "schedule", {"date": "2027-08-12"}, says=SCHED("2027-08-12")))

# 55 on the 16th
one(T("programme for the 16th?", "schedule_day", "schedule", {"date": "2027-08-16"}, says=SCHED("2027-08-16"), tags=["number_words"]))

# 56 fifth place
AA = "gym-m-all-around-final"
one(T("who came fifth in the mens all around", "contest_place", "who", {"contest": AA, "place": "5"}, says=at_place(AA, 5), tags=["number_words", "constraint"]))

# 57 voice mishearing of a name
conv(
    T("what country is bana gull lick from", "competitor_delegation", "group_of", {"competitor": "p131"}, says=[GN("orrindel")], tags=["voice", "mishearing"]),
    T("how did she go in the two hundred", "competitor_result", "how_did", {"competitor": "p131", "contest": "ath-w-200m-final"}, says=R("p131", "ath-w-200m-final"), tags=["voice", "follow_up", "pronoun", "number_words"]),
    T("and when does she run next", "competitor_next", "when", {"competitor": "p131"}, says=[time_of(next_contest("p131"))], tags=["voice", "follow_up", "pronoun"]),
    T("who else is in that race", "none", "other", outcome="not_covered", tags=["uncovered", "follow_up", "pronoun"]),
    tags=["voice"])

# 58 head to head without a contest (only one common race)
one(T("who finished higher in the road race tetha brelwick or lalia somayne", "head_to_head", "compare", {"competitor": "p210", "rival": "p215", "contest": RR}, says=[AHEAD("p210", "p215", RR)[0]], tags=["exact"]))

# 59 high jump live
conv(
    T("high jump - men - who's leading", "live_leader", "who", {"contest": HJ}, says=LEAD(HJ), tags=["constraint", "terse"]),
    T("what height has he cleared", "live_leader", "mark", {"contest": HJ}, says=[fmt(HJ, placed(HJ)[0]["mark"])], tags=["follow_up", "pronoun"]),
    U("is he going for the record", "other", tags=["follow_up", "pronoun"]),
    T("what about brellmoor in it", "delegation_in_event", "how_did", {"group": "brellmoor", "contest": HJ}, says=GR("brellmoor", HJ), tags=["follow_up", "pronoun"]))

# 60 not understood
one(T("asdkjh qwe", "none", "other", outcome="not_understood", tags=["gibberish"]))
one(T("play something relaxing on spotify", "none", "other", outcome="not_understood", tags=["off_topic"]))

# 61 swimmer profile, and a result he never swam
conv(
    T("tell me about jory halmvik", "competitor_profile", "profile", {"competitor": "p069"}, says=PROFILE("p069"), tags=["partial", "diacritics"]),
    T("how did he go in the 100 breast", "competitor_result", "how_did", {"competitor": "p069", "contest": "swm-m-100m-breaststroke-final"}, says=R("p069", "swm-m-100m-breaststroke-final"), tags=["follow_up", "pronoun"]),
    T("and what nationality", "competitor_delegation", "group_of", {"competitor": "p069"}, says=[GN("quessary")], tags=["follow_up", "ellipsis"]),
    U("how tall is he", "other", tags=["follow_up", "pronoun"]))

# 62 a DSQ
one(T("what happened to drada brorrorn in the 400", "competitor_result", "how_did", {"competitor": "p139", "contest": W400}, never=["1st", "2nd", "3rd"], tags=["exact"]))

# 63 men's road race, no venue
MR = "cyc-m-road-race-final"
conv(
    T("men's road race podium", "podium", "results", {"contest": MR}, says=podium(MR), tags=["terse", "constraint"]),
    T("winning time?", "competitor_result", "mark", {"competitor": "p101", "contest": MR}, says=[R("p101", MR)[1]], tags=["follow_up", "ellipsis"]),
    T("how many didnt finish", "none", "count", outcome="not_covered", tags=["uncovered", "follow_up"]),
    T("did thumard zevert win anything else", "competitor_medals", "whether", {"competitor": "p101"}, says=[MED("p101")], tags=["follow_up", "exact"]))

# 64 compare two delegations head to head: no intent
one(U("is kalvenmark ahead of vastrelia in silvers", "compare"))

# 65 medals by day and sport
conv(
    T("who won the most medals on thursday", "most_medals", "who", {"date": "2027-08-12"}, says=most_medals(date="2027-08-12")[0], tags=["constraint"]),
    T("top of the table that day", "medal_table_leader", "who", {"date": "2027-08-12"}, says=table_leaders(date="2027-08-12"), tags=["follow_up"]),
    T("and rowing medals overall, who leads", "medal_table_leader", "who", {"sport": "rowing"}, says=table_leaders(sport="rowing"), tags=["constraint", "new_question"]))

# 66 parents: where
conv(
    T("where's the swimming being held", "none", "where", outcome="not_covered", tags=["uncovered"]),
    T("ok where is the women's 400 im then", "contest_time", "where", {"contest": "swm-w-400m-individual-medley-final"}, says=[venue("swm-w-400m-individual-medley-final")], tags=["follow_up"]),
    U("is there parking there", "other", tags=["follow_up", "pronoun"]),
    T("what time", "contest_time", "when", {"contest": "swm-w-400m-individual-medley-final"}, says=[time_of("swm-w-400m-individual-medley-final")], tags=["follow_up", "ellipsis"]),
    tags=["parent"])

# 67 hoops
one(T("hoops final result", "full_results", "results", {"contest": BK}, says=top(BK, 2), tags=["terse", "partial"]))

# 68 marathon women
WM = "ath-w-marathon-final"
conv(
    T("winning margin in the women's marathon?", "competitor_margin", "margin", {"competitor": placed(WM)[0]["competitor"], "contest": WM}, says=MARGIN(placed(WM)[0]["competitor"], WM), tags=["constraint"]),
    T("who won bronze", "medalist", "who", {"contest": WM, "award": "bronze"}, says=medalists(WM, "bronze"), tags=["follow_up"]),
    U("what was her split at halfway", "mark", tags=["follow_up", "pronoun"]))

# 69 sport restriction the athlete medals intent lacks — athlete only does one sport, so ask by event
one(U("how many medals has hothic nuvasko won in freestyle events", "count", never=[MED("p072")], tags=["constraint"]))

# 70 voice: delegation nickname
conv(
    T("how many medals for the orrin dell islanders", "delegation_medals", "count", {"group": "orrindel"}, says=[GM("orrindel")], tags=["voice", "mishearing"]),
    T("how many of those are gold", "delegation_medals", "count", {"group": "orrindel", "award": "gold"}, says=[GM("orrindel", award="gold")], tags=["voice", "follow_up", "pronoun"]),
    T("and in the mens basketball", "delegation_in_event", "how_did", {"group": "orrindel", "contest": BK}, says=GR("orrindel", BK), tags=["voice", "follow_up", "ellipsis"]),
    tags=["voice"])

# 71 next for a cyclist
conv(
    T("when does velach mesoss race next", "competitor_next", "when", {"competitor": "p095"}, says=WHEN(next_contest("p095")), tags=["exact"]),
    T("what did he do in the road race", "competitor_result", "how_did", {"competitor": "p095", "contest": MR}, says=R("p095", MR), tags=["follow_up", "pronoun"]))

# 72 journalist fact-checking a margin and a place
conv(
    T("Checking a fact: Guvisse Tostanayne won the women's 200 fly by five hundredths?", "competitor_margin", "margin", {"competitor": "p190", "contest": "swm-w-200m-butterfly-final"}, says=MARGIN("p190", "swm-w-200m-butterfly-final"), tags=["journalist"]),
    T("And Zoë Quillon was third in that race?", "competitor_result", "whether", {"competitor": "p196", "contest": "swm-w-200m-butterfly-final"}, says=R("p196", "swm-w-200m-butterfly-final")[:1], tags=["follow_up", "journalist"]),
    T("What did Tostanayne do in the breaststroke?", "competitor_result", "how_did", {"competitor": "p190", "contest": "swm-w-100m-breaststroke-final"}, says=R("p190", "swm-w-100m-breaststroke-final"), tags=["partial", "follow_up"]),
    U("Spelling of her name in her native script?", "other", tags=["follow_up", "pronoun"]),
    tags=["journalist"])

# 73 breaststroke men, dsq
one(U("why was dradic kromwick disqualified", "other", tags=["exact"]))

# 74 mishearing 'a nice' for Anaïs
conv(
    T("how did a nice cord vel do this morning", "competitor_result", "how_did", {"competitor": "p124", "contest": "ath-w-100m-heat-1"}, says=R("p124", "ath-w-100m-heat-1"), tags=["voice", "mishearing", "relative_day", "constraint"]),
    T("is she in the final", "competitor_next", "when", {"competitor": "p124"}, says=[time_of(W100)], tags=["voice", "follow_up", "pronoun"]),
    tags=["voice"])

# 75 floor exercise alias, bronze
one(T("bronze in the womens floor exercise?", "medalist", "who", {"contest": GF, "award": "bronze"}, says=medalists(GF, "bronze"), tags=["terse"]))

# 76 medal table top ten by gold
conv(
    T("top ten nations by golds", "medal_table_top", "table", {"award": "gold", "count": "10"}, says=SAFE_TOP(10, award="gold"), tags=["number_words", "constraint"]),
    T("and what about bronzes only", "medal_table_top", "table", {"award": "bronze", "count": "10"}, says=SAFE_TOP(10, award="bronze"), tags=["follow_up", "constraint"]),
    U("which country has the most medals per head of population", "table", tags=["follow_up"]))

# 77 typo-heavy
conv(
    T("hwo won teh womens 1500", "podium", "who", {"contest": "ath-w-1500m-final"}, says=medalists("ath-w-1500m-final", "gold"), tags=["misspelling"]),
    T("what countyr is she from", "competitor_delegation", "group_of", {"competitor": "p141"}, says=[GN("kalvenmark")], tags=["misspelling", "follow_up", "pronoun"]),
    T("waht was her time", "competitor_result", "mark", {"competitor": "p141", "contest": "ath-w-1500m-final"}, says=[R("p141", "ath-w-1500m-final")[1]], tags=["misspelling", "follow_up", "pronoun"]))

# 78 today's schedule, then a sport restriction
conv(
    T("what's on today", "schedule_day", "schedule", {"date": D_TODAY}, says=SCHED(D_TODAY), tags=["relative_day"]),
    T("just athletics", "schedule_day", "schedule", {"date": D_TODAY, "sport": "athletics"}, says=SCHED(D_TODAY, "athletics"), tags=["follow_up", "constraint"]),
    T("only the stuff at the stadium", "none", "schedule", outcome="not_covered", never=[venue(MAR)], tags=["uncovered", "follow_up", "constraint"]),
    T("ok what's happening right now in athletics", "under_way", "schedule", {"sport": "athletics"}, says=sorted({DN("athletics", C[c]["discipline"]) for c in live("athletics")}), tags=["follow_up", "constraint"]))

# 79 vault: scheduled
GV = "gym-w-vault-final"
conv(
    T("who won the womens vault", "podium", "who", {"contest": GV}, outcome="no_data", tags=["constraint"]),
    T("when is it", "contest_time", "when", {"contest": GV}, says=WHEN(GV), tags=["follow_up", "pronoun"]),
    T("is zoe tassevar in it", "none", "whether", outcome="not_covered", tags=["uncovered", "follow_up", "diacritics"]))

# 80 head to head, voice, swimming
FR2m = "swm-m-200m-freestyle-final"
one(T("did issov fusty sessy beat hothic nuvasko in the two hundred free", "head_to_head", "compare", {"competitor": "p082", "rival": "p072", "contest": FR2m}, says=[AHEAD("p082", "p072", FR2m)[0]], tags=["voice", "mishearing", "number_words"]))

# 81 live leader, score gap
conv(
    T("all around leader right now", "live_leader", "who", {"contest": WAA}, says=[LEAD(WAA)[0]], tags=["terse"]),
    T("what's her score", "live_leader", "mark", {"contest": WAA}, says=[fmt(WAA, placed(WAA)[0]["mark"])], tags=["follow_up", "pronoun"]),
    T("who is third", "contest_place", "who", {"contest": WAA, "place": "3"}, says=at_place(WAA, 3), tags=["follow_up", "ellipsis"]),
    T("how many rotations are left", "none", "status", outcome="not_covered", tags=["uncovered", "follow_up"]))

# 82 400 m men
M4 = "ath-m-400m-final"
conv(
    T("400m men gold silver bronze", "podium", "results", {"contest": M4}, says=podium(M4), tags=["terse", "constraint"]),
    T("did corvanthe get one", "delegation_in_event", "whether", {"group": "corvanthe", "contest": M4}, says=GR("corvanthe", M4)[:1], tags=["follow_up", "pronoun"]),
    T("and kalvenmark overall how many medals have they got", "delegation_medals", "count", {"group": "kalvenmark"}, says=[GM("kalvenmark")], tags=["new_question"]))

# 83 someone who isn't on any list, then a real name
conv(
    T("has stilo trurideroy competed yet", "competitor_profile", "profile", {"competitor": "p108"}, outcome="no_data", tags=["exact"], ),
    T("what delegation is he with", "competitor_delegation", "group_of", {"competitor": "p108"}, says=[GN(P["p108"]["group"])], tags=["follow_up", "pronoun"]))

# 84 ask-back for a missing detail
conv(
    T("who came third", "contest_place", "who", {"place": "3"}, outcome="clarify", tags=["missing_slot", "clarify"]),
    T("the men's long jump", "contest_place", "who", {"contest": "ath-m-long-jump-final", "place": "3"}, says=at_place("ath-m-long-jump-final", 3), tags=["follow_up"]),
    T("what distance", "competitor_result", "mark", {"competitor": placed("ath-m-long-jump-final")[2]["competitor"], "contest": "ath-m-long-jump-final"}, says=[fmt("ath-m-long-jump-final", placed("ath-m-long-jump-final")[2]["mark"])], tags=["follow_up", "ellipsis"]))

# 85 javelin women, a margin for the loser
WJ = "ath-w-javelin-final"
one(T("how far off gold was sevora gurrorn in the javelin", "competitor_margin", "margin", {"competitor": "p182", "contest": WJ}, says=MARGIN("p182", WJ), tags=["exact"]))

# 86 swimming fan
FLm, F1m = "swm-m-200m-butterfly-final", "swm-m-100m-freestyle-final"
conv(
    T("who won the mens 200 fly", "podium", "who", {"contest": FLm}, says=medalists(FLm, "gold"), tags=["partial", "constraint"]),
    T("his time?", "competitor_result", "mark", {"competitor": "p072", "contest": FLm}, says=[R("p072", FLm)[1]], tags=["follow_up", "pronoun"]),
    T("how many medals has he won altogether", "competitor_medals", "count", {"competitor": "p072"}, says=[MED("p072")], tags=["follow_up", "pronoun"]),
    T("did he beat guntasand in the 100 free", "head_to_head", "compare", {"competitor": "p072", "rival": "p083", "contest": F1m}, says=[AHEAD("p072", "p083", F1m)[0]], tags=["follow_up", "pronoun", "partial"]),
    T("what about in the fly", "head_to_head", "compare", {"competitor": "p072", "rival": "p083", "contest": FLm}, says=[AHEAD("p072", "p083", FLm)[0]], tags=["follow_up", "ellipsis"]),
    T("thanks mate", "thanks", "chat", {}, tags=["thanks_between"]),
    tags=["fan"])

# 87 commuter: sunday plans
conv(
    T("whats on sunday", "schedule_day", "schedule", {"date": D_TOM}, says=SCHED(D_TOM), tags=["relative_day"]),
    T("what time is the women's sprint final", "contest_time", "when", {"contest": W100}, says=[time_of(W100)], tags=["follow_up", "partial"]),
    T("where", "contest_time", "where", {"contest": W100}, says=[venue(W100)], tags=["follow_up", "ellipsis"]),
    U("who's running in it", "other", tags=["follow_up", "pronoun"]),
    T("who won the men's version", "podium", "who", {"contest": M100}, says=medalists(M100, "gold"), tags=["follow_up"]))

# 88 Tolmerin
conv(
    T("how many medals has tolmerin won", "delegation_medals", "count", {"group": "tolmerin"}, says=[GM("tolmerin")], tags=["exact"]),
    T("where are they in the table", "delegation_medals", "rank", {"group": "tolmerin"}, says=[RANK("tolmerin")], tags=["follow_up", "pronoun"]),
    T("any in swimming", "delegation_medals", "count", {"group": "tolmerin", "sport": "swimming"}, says=[GM("tolmerin", sport="swimming")], tags=["follow_up", "constraint"]),
    U("which of their swimmers won it", "who", tags=["follow_up", "pronoun"]))

# 89 Émeric Tollevant through the rounds
H1 = "ath-m-100m-heat-1"
bhm = best_mark_all("athletics", "100m", "men", "heat")
conv(
    T("how did emeric tollevant do in the 100 final", "competitor_result", "how_did", {"competitor": "p007", "contest": M100}, says=R("p007", M100), tags=["diacritics", "constraint"]),
    T("and in his heat", "competitor_result", "how_did", {"competitor": "p007", "contest": H1}, says=R("p007", H1), tags=["follow_up", "pronoun", "constraint"]),
    T("who won that heat", "contest_place", "who", {"contest": H1, "place": "1"}, says=at_place(H1, 1), tags=["follow_up", "pronoun"]),
    T("what was the quickest heat time overall", "best_mark", "mark", {"discipline": "athletics/100m", "category": "men", "round": "heat"}, says=[bhm[0]] + bhm[1], tags=["follow_up", "constraint"]))

# 90 mis-heard delegation
conv(
    T("how many golds for vast really a", "delegation_medals", "count", {"group": "vastrelia", "award": "gold"}, says=[GM("vastrelia", award="gold")], tags=["voice", "mishearing"]),
    T("and silvers", "delegation_medals", "count", {"group": "vastrelia", "award": "silver"}, says=[GM("vastrelia", award="silver")], tags=["voice", "follow_up", "ellipsis"]),
    T("what about bronze", "delegation_medals", "count", {"group": "vastrelia", "award": "bronze"}, says=[GM("vastrelia", award="bronze")], tags=["voice", "follow_up", "ellipsis"]),
    T("where are they ranked", "delegation_medals", "rank", {"group": "vastrelia"}, says=[RANK("vastrelia")], tags=["voice", "follow_up", "pronoun"]),
    tags=["voice"])

# 91 a named weekday
mg = most_medals(date="2027-08-10", award="gold")
conv(
    T("who won the most golds on tuesday", "most_medals", "who", {"date": "2027-08-10", "award": "gold"}, says=mg[0], tags=["constraint"]),
    T("what was on that day", "schedule_day", "schedule", {"date": "2027-08-10"}, says=SCHED("2027-08-10"), tags=["follow_up", "pronoun"]),
    T("and wednesday's leader in the medals", "medal_table_leader", "who", {"date": "2027-08-11"}, says=table_leaders(date="2027-08-11"), tags=["follow_up", "constraint"]))

# 92 rowing and cycling times
WDS, MTT = "row-w-double-sculls-final", "cyc-m-time-trial-final"
conv(
    T("when is the women's double sculls", "contest_time", "when", {"contest": WDS}, says=WHEN(WDS), tags=["constraint"]),
    T("and the men's time trial", "contest_time", "when", {"contest": MTT}, says=WHEN(MTT), tags=["follow_up", "ellipsis"]),
    U("who is the favourite for that", "who", tags=["follow_up", "pronoun"]),
    T("who won the women's tt", "podium", "who", {"contest": TT}, says=medalists(TT, "gold"), tags=["partial"]))

# 93 a swimmer's events
conv(
    T("what events is kanisse trilkell swimming", "competitor_sport", "sport_of", {"competitor": "p189"}, says=DISC("p189"), tags=["exact"]),
    T("results so far?", "competitor_profile", "profile", {"competitor": "p189"}, says=PROFILE("p189"), tags=["follow_up", "ellipsis"]),
    T("is she swimming tomorrow", "competitor_next", "whether", {"competitor": "p189"}, says=[time_of(next_contest("p189"))], tags=["follow_up", "pronoun", "relative_day"]))

# 94 live head to head
one(T("is lomov kerreth ahead of vathen korvace", "head_to_head", "compare", {"competitor": "p053", "rival": "p057", "contest": HJ}, says=[AHEAD("p053", "p057", HJ)[0]], tags=["exact"]))

# 95 - 98 singles
one(T("myrrhaven medal count", "delegation_medals", "count", {"group": "myrrhaven"}, says=[GM("myrrhaven")], tags=["terse"]))
one(U("how many golds has kalvenmark won in women's events", "count", never=[GM("kalvenmark", award="gold")], tags=["constraint"]))
one(T("top of the medal table on wednesday?", "medal_table_leader", "who", {"date": "2027-08-11"}, says=table_leaders(date="2027-08-11"), tags=["constraint"]))
one(T("who came 2nd in the mens 400 metres", "contest_place", "who", {"contest": M4, "place": "2"}, says=at_place(M4, 2), tags=["constraint"]))

# 99 basketball, greeting first
conv(
    T("hi there", "greeting", "chat", {}),
    T("who won the men's basketball", "podium", "who", {"contest": BK}, says=medalists(BK, "gold"), tags=["constraint"]),
    T("who got the bronze", "medalist", "who", {"contest": BK, "award": "bronze"}, says=medalists(BK, "bronze"), tags=["follow_up"]),
    T("when's the women's final", "contest_time", "when", {"contest": BW}, says=WHEN(BW), tags=["follow_up"]),
    U("are dunmerrow in that one too", "whether", tags=["follow_up", "pronoun"]))

# 100 journalist, marathon women
conv(
    T("Confirm: Trema Zulren won the women's marathon?", "podium", "whether", {"contest": WM}, says=medalists(WM, "gold"), tags=["journalist", "exact"]),
    T("Her time?", "competitor_result", "mark", {"competitor": "p153", "contest": WM}, says=[R("p153", WM)[1]], tags=["follow_up", "pronoun"]),
    T("Margin over second?", "competitor_margin", "margin", {"competitor": "p153", "contest": WM}, says=MARGIN("p153", WM), tags=["follow_up", "ellipsis"]),
    T("Her delegation?", "competitor_delegation", "group_of", {"competitor": "p153"}, says=[GN(P["p153"]["group"])], tags=["follow_up", "pronoun"]),
    T("And that delegation's gold count?", "delegation_medals", "count", {"group": "kalvenmark", "award": "gold"}, says=[GM("kalvenmark", award="gold")], tags=["follow_up", "pronoun"]),
    T("Thanks, that's all.", "thanks", "chat", {}),
    tags=["journalist"])

# 101 all outside the data
conv(
    U("who's carrying the flag at the closing ceremony", "other"),
    U("when do the games actually finish", "when"),
    U("whats the weather meant to be for the womens 100 final", "other", tags=["follow_up"]),
    U("how do i get to fennick arena from the harbour", "where"))

# 102 breaststroke men
BRm = "swm-m-100m-breaststroke-final"
conv(
    T("who won the men's 100 breaststroke", "podium", "who", {"contest": BRm}, says=medalists(BRm, "gold"), tags=["constraint"]),
    U("was anyone disqualified", "other", tags=["follow_up"]),
    T("how did jory do in it", "competitor_result", "how_did", {"competitor": "p069", "contest": BRm}, says=R("p069", BRm), tags=["follow_up", "partial", "pronoun"]),
    T("and in the 200 free", "competitor_result", "how_did", {"competitor": "p069", "contest": FR2m}, says=R("p069", FR2m), tags=["follow_up", "ellipsis"]))

# 103 gymnastics best marks
bf, bfw, baa = best_mark_all("gymnastics", "floor"), best_mark_all("gymnastics", "floor", "women"), best_mark_all("gymnastics", "all-around")
conv(
    T("highest floor score so far", "best_mark", "mark", {"discipline": "gymnastics/floor"}, says=[bf[0]] + bf[1]),
    T("womens?", "best_mark", "mark", {"discipline": "gymnastics/floor", "category": "women"}, says=[bfw[0]] + bfw[1], tags=["follow_up", "ellipsis", "constraint"]),
    T("and best all-around total", "best_mark", "mark", {"discipline": "gymnastics/all-around"}, says=[baa[0]] + baa[1], tags=["follow_up"]),
    U("what was the difficulty score in that", "mark", tags=["follow_up", "pronoun"]))

# 104 high jump, an athlete in it
conv(
    T("how's the men's high jump going", "live_leader", "who", {"contest": HJ}, says=[LEAD(HJ)[0]], tags=["contraction", "chatty"]),
    T("where's thadach cossasko", "competitor_result", "how_did", {"competitor": "p059", "contest": HJ}, says=R("p059", HJ), tags=["follow_up"]),
    T("how far behind the leader is he", "competitor_margin", "margin", {"competitor": "p059", "contest": HJ}, says=MARGIN("p059", HJ), tags=["follow_up", "pronoun"]))

# 105 voice, a delegation
conv(
    T("pell a via medal count", "delegation_medals", "count", {"group": "pellavia"}, says=[GM("pellavia")], tags=["voice", "mishearing", "terse"]),
    T("whats their rank", "delegation_medals", "rank", {"group": "pellavia"}, says=[RANK("pellavia")], tags=["voice", "follow_up", "pronoun"]),
    tags=["voice"])

# 106 - 108 singles
one(T("Who got the gold in the 400 metres for women?", "medalist", "who", {"contest": W400, "award": "gold"}, says=medalists(W400, "gold"), tags=["constraint"]))
one(T("what did zemim guntasand clock in the hundred free", "competitor_result", "mark", {"competitor": "p083", "contest": F1m}, says=[R("p083", F1m)[1]], tags=["number_words"]))
MLJ = "ath-m-long-jump-final"
one(T("my son wants to know who won the mens long jump and how far he went", "podium", "who", {"contest": MLJ}, says=medalists(MLJ, "gold") + [fmt(MLJ, placed(MLJ)[0]["mark"])], tags=["chatty", "constraint"]))

# 109 a heat-only sprinter
conv(
    T("who is welel fessell", "competitor_profile", "profile", {"competitor": "p003"}, says=PROFILE("p003"), tags=["exact"]),
    T("what country", "competitor_delegation", "group_of", {"competitor": "p003"}, says=[GN(P["p003"]["group"])], tags=["follow_up", "ellipsis"]),
    T("did he make the final", "competitor_result", "whether", {"competitor": "p003", "contest": M100}, tags=["follow_up", "pronoun"]))

# 110 - 112 uncovered singles
one(U("whats the prize money for winning gold", "other"))
one(U("how many people watched the basketball final", "count"))
one(U("what's up next at the stadium", "schedule", tags=["constraint"]))

# 113 start over in the middle
RWS = "row-w-single-sculls-final"
conv(
    T("who won the women's single sculls", "podium", "who", {"contest": RWS}, says=medalists(RWS, "gold"), tags=["constraint"]),
    T("how did zoe marrant do", "competitor_result", "how_did", {"competitor": "p199", "contest": RWS}, says=R("p199", RWS), tags=["follow_up", "diacritics"]),
    T("by how much did she miss out on bronze", "none", "margin", outcome="not_covered", tags=["uncovered", "follow_up", "pronoun"]),
    T("ok never mind, thanks anyway", "thanks", "chat", {}, tags=["thanks_between"]),
    T("medal table top four", "medal_table_top", "table", {"count": "4"}, says=TOPN(4), tags=["number_words", "new_question"]))

# 114 women's 200, number words, voice
W2 = "ath-w-200m-final"
conv(
    T("who won the women's two hundred metres", "podium", "who", {"contest": W2}, says=medalists(W2, "gold"), tags=["voice", "number_words"]),
    T("what was the winning time", "competitor_result", "mark", {"competitor": placed(W2)[0]["competitor"], "contest": W2}, says=[fmt(W2, placed(W2)[0]["mark"])], tags=["voice", "follow_up"]),
    T("who was fourth", "contest_place", "who", {"contest": W2, "place": "4"}, says=at_place(W2, 4), tags=["voice", "follow_up", "ellipsis"]),
    T("how far behind the winner was she", "competitor_margin", "margin", {"competitor": placed(W2)[3]["competitor"], "contest": W2}, says=MARGIN(placed(W2)[3]["competitor"], W2), tags=["voice", "follow_up", "pronoun"]),
    tags=["voice"])

# 115 women's breaststroke, a delegation's athlete in an event
BRw = "swm-w-100m-breaststroke-final"
conv(
    T("how did brellmoor do in the women's 100 breaststroke", "delegation_in_event", "how_did", {"group": "brellmoor", "contest": BRw}, says=GR("brellmoor", BRw), tags=["constraint"]),
    T("who beat her", "competitor_margin", "who", {"competitor": "p191", "contest": BRw}, says=[margin("p191", BRw)[0]], tags=["follow_up", "pronoun"]),
    T("and by how much", "competitor_margin", "margin", {"competitor": "p191", "contest": BRw}, says=MARGIN("p191", BRw), tags=["follow_up", "ellipsis"]),
    U("is that her personal best", "mark", tags=["follow_up", "pronoun"]))

# 116 quay rocket
conv(
    T("when does the quay rocket race next", "competitor_next", "when", {"competitor": "p005"}, outcome="no_data", tags=["partial"]),
    T("what events did he do", "competitor_sport", "sport_of", {"competitor": "p005"}, says=DISC("p005"), tags=["follow_up", "pronoun"]),
    T("top 3 in his 200", "full_results", "results", {"contest": "ath-m-200m-final", "count": "3"}, says=top("ath-m-200m-final", 3), tags=["follow_up", "pronoun", "number_words"]))

# ---------------------------------------------------------------- checks and output
import yaml
ALLOWED = {"ask", "intent", "slots", "outcome", "focus", "says", "never", "tags"}
FOCUS = set("who how_did results count rank table margin mark when where schedule status whether compare group_of sport_of profile open chat other".split())
OUTCOMES = {"answered", "clarify", "no_data", "not_covered", "not_understood"}
def turns():
    for c in CASES:
        for t in (c["conversation"] if "conversation" in c else [c]): yield c, t
for c, t in turns():
    assert set(t) <= ALLOWED | ({"conversation"} if False else set()), t
    assert t["focus"] in FOCUS and t["outcome"] in OUTCOMES, t
    assert all(isinstance(x, str) and x for x in t.get("says", []) + t.get("never", [])), t
    assert not (set(t.get("says", [])) & set(t.get("never", []))), t
    if t["intent"] == "none": assert "slots" not in t and t["outcome"] in ("not_covered", "not_understood"), t
for c in CASES:
    if "conversation" in c: assert 2 <= len(c["conversation"]) <= 6, c
all_t = [t for _, t in turns()]
unc = [t for t in all_t if "uncovered" in t.get("tags", [])]
n_conv = sum(1 for c in CASES if "conversation" in c)
HEADER = f"""# Blind question set: scenario games, moment Saturday 14 August 2027 21:10 (Europe/Lisbon, +01:00),
# data as of 21:04; "today" 2027-08-14, "tomorrow" 2027-08-15, "yesterday" 2027-08-13.
# Written by tests/eval/blind/round7/label_games.py from dataset-demo/games/*.json; do not edit by hand.
# {len(CASES)} cases ({n_conv} conversations, {len(CASES) - n_conv} single questions), {len(all_t)} turns,
# {len(unc)} uncovered ({100 * len(unc) / len(all_t):.1f}%).
"""
out = os.path.join(os.path.dirname(os.path.abspath(__file__)), "games.yaml")
with open(out, "w", encoding="utf-8") as f:
    f.write(HEADER)
    yaml.safe_dump(CASES, f, allow_unicode=True, sort_keys=False, width=1000, default_flow_style=None)
yaml.safe_load(open(out, encoding="utf-8"))
print(f"{out}: {len(CASES)} cases, {len(all_t)} turns, uncovered {len(unc)} ({100 * len(unc) / len(all_t):.1f}%)")
