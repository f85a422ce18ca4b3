#!/usr/bin/env python3
"""Blind question set for scenario `games`, moment Saturday 14 August 2027 21:10
Europe/Lisbon (data as of 21:04). Every expected fact is computed from
dataset-demo/games/*.json. Writes games.yaml beside this script."""
import json, os, sys
from collections import defaultdict
import yaml

HERE = os.path.dirname(os.path.abspath(__file__))
DATA = os.path.normpath(os.path.join(HERE, '..', '..', '..', '..', 'dataset-demo', 'games'))
def load(n):
    with open(os.path.join(DATA, n), encoding='utf-8') as f:
        return json.load(f)
COMP = {c['id']: c for c in load('competitors.json')}
CONT = {c['id']: c for c in load('contests.json')}
GROUPS = {g['id']: g for g in load('groups.json')}
SPORTS = {s['id']: s for s in load('sports.json')}
SCEN = load('scenario.json')
TODAY, TOMORROW, YESTERDAY = '2027-08-14', '2027-08-15', '2027-08-13'
NOW = '2027-08-14T21:10'
WORDS = 'zero one two three four five six seven eight nine'.split()

def cnt(n): return WORDS[n] if 0 <= n < 10 else str(n)
def ordinal(n):
    return '%d%s' % (n, 'th' if 10 <= n % 100 <= 20 else {1: 'st', 2: 'nd', 3: 'rd'}.get(n % 10, 'th'))
def name(pid): c = COMP[pid]; return '%s %s' % (c['given'], c['family'])
def gname(gid): return GROUPS[gid]['name']
def ename(e): return name(e['competitor']) if 'competitor' in e else gname(e['group'])
def fmt(cid, mark):
    m = CONT[cid]['measure']
    if m == 'time':
        return mark + ' s' if ':' not in mark else mark
    if m == 'distance': return mark + ' m'
    return mark
def entry(cid, who):
    for e in CONT[cid]['entries']:
        if e.get('competitor') == who or e.get('group') == who: return e
    raise KeyError((cid, who))
def at_place(cid, p): return [e for e in CONT[cid]['entries'] if e.get('place') == p]
def medal(cid, award): return [ename(e) for e in CONT[cid]['entries'] if e.get('award') == award]
def mark_of(cid, who): return fmt(cid, entry(cid, who)['mark'])
def place_of(cid, who): return ordinal(entry(cid, who)['place'])
def secs(m):
    parts = [float(x) for x in m.split(':')]; v = 0.0
    for p in parts: v = v * 60 + p
    return v
def gap(cid, a, b):
    d = abs(secs(entry(cid, a)['mark']) - secs(entry(cid, b)['mark']))
    dec = len(entry(cid, a)['mark'].split('.')[-1]) if '.' in entry(cid, a)['mark'] else 0
    return ('%.' + str(dec) + 'f') % d
def leader(cid):
    assert CONT[cid]['status'] == 'live'
    return ename(at_place(cid, 1)[0])
def topn(cid, n): return [ename(e) for e in sorted([e for e in CONT[cid]['entries'] if 'place' in e], key=lambda e: e['place'])[:n]]
def all_names(cid): return [ename(e) for e in CONT[cid]['entries']]
def hm(cid): return CONT[cid]['start'][11:16]
def day_of(cid): return CONT[cid]['start'][:10]

def medals_table(sport=None, date=None, award=None):
    t = defaultdict(lambda: {'gold': 0, 'silver': 0, 'bronze': 0})
    for c in CONT.values():
        if sport and c['sport'] != sport: continue
        if date and day_of(c['id']) != date: continue
        for e in c['entries']:
            a = e.get('award')
            if not a: continue
            g = e['group'] if 'group' in e else COMP[e['competitor']]['group']
            t[g][a] += 1
    return t
def total(r): return r['gold'] + r['silver'] + r['bronze']
def ranked(sport=None, date=None, award=None):
    t = medals_table(sport, date)
    if award: key = lambda g: -t[g][award]
    else: key = lambda g: (-t[g]['gold'], -t[g]['silver'], -t[g]['bronze'])
    return sorted(t, key=key), t
def table_leader(**kw):
    """names of the delegation(s) at the top (ties give several)"""
    order, t = ranked(**kw)
    k = lambda g: (t[g]['gold'], t[g]['silver'], t[g]['bronze']) if not kw.get('award') else t[g][kw['award']]
    return [gname(g) for g in order if k(g) == k(order[0])]
def second_places(**kw):
    order, t = ranked(**kw)
    k = lambda g: (t[g]['gold'], t[g]['silver'], t[g]['bronze'])
    rest = [g for g in order if k(g) != k(order[0])]
    return [gname(g) for g in rest if k(g) == k(rest[0])]
def most_medals(**kw):
    """(names of the delegation(s) with most medals, that total, names of the rest)"""
    t = medals_table(kw.get('sport'), kw.get('date'))
    top = max(total(r) for r in t.values())
    return [gname(g) for g in t if total(t[g]) == top], top, [gname(g) for g in t if total(t[g]) != top]
def group_rank(g):
    order, t = ranked()
    k = lambda x: (t[x]['gold'], t[x]['silver'], t[x]['bronze'])
    return ordinal(1 + sum(1 for x in order if k(x) > k(g)))
def comp_medals(pid, award=None):
    n = 0
    for c in CONT.values():
        for e in c['entries']:
            if e.get('award') and (award is None or e['award'] == award) and (e.get('competitor') == pid or pid in e.get('members', [])):
                n += 1
    return n
def comp_contests(pid):
    return sorted([c['id'] for c in CONT.values() if any(e.get('competitor') == pid or pid in e.get('members', []) for e in c['entries'])], key=lambda i: CONT[i]['start'])
def next_contest(pid):
    fut = [c for c in comp_contests(pid) if CONT[c]['status'] == 'scheduled']
    return fut[0] if fut else None
def day_contests(date, sport=None):
    return [c for c in CONT.values() if day_of(c['id']) == date and (sport is None or c['sport'] == sport)]
def live(sport=None): return [c['id'] for c in CONT.values() if c['status'] == 'live' and (sport is None or c['sport'] == sport)]
def best(disc, cat=None, sport=None):
    cs = [c for c in CONT.values() if c['discipline'] == disc and (cat is None or c['category'] == cat) and (sport is None or c['sport'] == sport)]
    best = None
    for c in cs:
        for e in c['entries']:
            if 'mark' not in e or e.get('status'): continue
            v = secs(e['mark'])
            better = best is None or ((v < best[0]) if c['measure'] == 'time' else (v > best[0]))
            if better: best = (v, fmt(c['id'], e['mark']), ename(e))
    return best

def find(given=None, family=None):
    r = [p for p, c in COMP.items() if (given is None or c['given'] == given) and (family is None or c['family'] == family)]
    return r

# ---------------------------------------------------------------- helpers to write turns
def T(ask, intent=None, slots=None, outcome='answered', focus=None, says=None, never=None, tags=None):
    d = {'ask': ask, 'intent': intent or 'none'}
    if intent: d['slots'] = slots or {}
    d['outcome'] = outcome
    if focus: d['focus'] = focus
    if says: d['says'] = list(says)
    if never: d['never'] = list(never)
    if tags: d['tags'] = list(tags)
    return d
def U(ask, focus='other', never=None, tags=None, outcome='not_covered'):
    return T(ask, None, None, outcome, focus, None, never, ['uncovered'] + list(tags or []))
def CONV(*turns, tags=None):
    d = {'conversation': list(turns)}
    if tags: d['tags'] = list(tags)
    return d

cases = []
add = cases.append

# ---- ids used
WON = 'p005'; LIR = 'p001'; BAN = 'p002'; TRU = 'p010'
M100 = 'ath-m-100m-final'; W100 = 'ath-w-100m-final'; M200 = 'ath-m-200m-final'; W200 = 'ath-w-200m-final'
MMAR = 'ath-m-marathon-final'; MHJ = 'ath-m-high-jump-final'; MJAV = 'ath-m-javelin-final'; WAA = 'gym-w-all-around-final'
BKM = 'bkb-m-tournament-final'; BKW = 'bkb-w-tournament-final'
W200FR = 'swm-w-200m-freestyle-final'; W200FL = 'swm-w-200m-butterfly-final'; M200FL = 'swm-m-200m-butterfly-final'
ZOES = find(given='Zoë')
assert len(ZOES) == 3
KOV = find(family='Kovendal'); assert len(KOV) == 2
LEAD = table_leader(); assert len(LEAD) == 1; lead_t = LEAD[0]; second_t = second_places()

# ============================== single questions
add(T("who won the mens 100m", 'podium', {'contest': M100}, focus='who', says=medal(M100, 'gold'), never=[name(LIR)] and None, tags=['exact']))
add(T("who took gold in the men's sprint final?", 'medalist', {'contest': M100, 'award': 'gold'}, focus='who', says=medal(M100, 'gold'), never=medal(M100, 'silver'), tags=['exact']))
add(T("200 fly women podium pls", 'podium', {'contest': W200FL}, focus='results', says=medal(W200FL, 'gold') + medal(W200FL, 'silver') + medal(W200FL, 'bronze'), tags=['partial', 'constraint']))
add(T("who got silver in the womens 200 free", 'medalist', {'contest': W200FR, 'award': 'silver'}, focus='who', says=medal(W200FR, 'silver'), never=medal(W200FR, 'gold'), tags=['contraction', 'partial']))
add(T("who's leading the men's marathon right now", 'live_leader', {'contest': MMAR}, focus='who', says=[leader(MMAR)], tags=['contraction']))
add(T("whos ahead in the high jump at the moment", 'live_leader', {'contest': MHJ}, focus='who', says=[leader(MHJ), fmt(MHJ, at_place(MHJ, 1)[0]['mark'])], tags=['misspelling']))
add(T("javelin - who's in front and by how much?", 'live_leader', {'contest': MJAV}, focus='margin', says=[leader(MJAV), gap(MJAV, at_place(MJAV, 1)[0]['competitor'], at_place(MJAV, 2)[0]['competitor'])], tags=['partial']))
add(T("what's happening right now", 'under_way', {}, focus='schedule', says=[SPORTS[CONT[c]['sport']]['disciplines'][[d['id'] for d in SPORTS[CONT[c]['sport']]['disciplines']].index(CONT[c]['discipline'])]['name'] for c in live()], tags=['chatty']))
add(T("anything on in gymnastics rn?", 'under_way', {'sport': 'gymnastics'}, focus='schedule', says=['all-around'], never=['marathon', 'javelin'], tags=['constraint', 'contraction']))
add(T("what's on tomorrow", 'schedule_day', {'date': TOMORROW}, focus='schedule', says=[hm(c['id']) for c in day_contests(TOMORROW)], tags=['relative_day']))
add(T("swimming schedule for monday", 'schedule_day', {'date': '2027-08-16', 'sport': 'swimming'}, focus='schedule', says=[hm(c['id']) for c in day_contests('2027-08-16', 'swimming')], never=[hm('gym-w-vault-final')], tags=['constraint']))
add(T("medal table top 5", 'medal_table_top', {'count': '5'}, focus='table', says=[gname(g) for g in ranked()[0][:5]], tags=['exact']))
add(T("who is top of the medals table", 'medal_table_leader', {}, focus='who', says=[lead_t], never=second_t, tags=['exact']))
mm, mmn, mm2 = most_medals()
add(T("which delegation has the most medals overall, counting all colours", 'most_medals', {}, focus='who', says=mm + [str(mmn) if mmn >= 10 else cnt(mmn)], never=[lead_t] if lead_t not in mm else None, tags=['exact', 'tie']))
kv = medals_table()['kalvenmark']
add(T("how many medals has kalvenmark got", 'delegation_medals', {'group': 'kalvenmark'}, focus='count', says=[str(total(kv)) if total(kv) >= 10 else cnt(total(kv))], tags=['exact']))
q = medals_table()['quessary']
add(T("how many golds for quessary so far?", 'delegation_medals', {'group': 'quessary', 'award': 'gold'}, focus='count', says=[cnt(q['gold'])], tags=['constraint']))
add(T("wheres team vastrelia in the medal standings", 'delegation_medals', {'group': 'vastrelia'}, focus='rank', says=[group_rank('vastrelia')], tags=['misspelling']))
sw = ranked(sport='swimming')
add(T("who leads the swimming medal table", 'medal_table_leader', {'sport': 'swimming'}, focus='who', says=table_leader(sport='swimming'), tags=['constraint']))
add(T("which country won the most medals yesterday", 'most_medals', {'date': YESTERDAY}, focus='who', says=most_medals(date=YESTERDAY)[0], tags=['relative_day', 'constraint', 'tie']))
add(T("what country is Lomov Kerreth from", 'competitor_delegation', {'competitor': 'p053'}, focus='group_of', says=[gname(COMP['p053']['group'])], tags=['exact']))
add(T("which team is jory on", 'competitor_delegation', {'competitor': 'p069'}, focus='group_of', says=[gname(COMP['p069']['group'])], tags=['partial', 'alias']))
add(T("what sport does Tetha Brelwick do", 'competitor_sport', {'competitor': 'p210'}, focus='sport_of', says=['cycling'], tags=['exact']))
add(T("what events is hothic nuvasko swimming", 'competitor_sport', {'competitor': 'p072'}, focus='sport_of', says=['swimming'], tags=['diacritics']))
add(T("how many medals has the quay rocket won", 'competitor_medals', {'competitor': WON}, focus='count', says=[cnt(comp_medals(WON))], tags=['alias']))
add(T("how many golds does tetha brelwick have", 'competitor_medals', {'competitor': 'p210', 'award': 'gold'}, focus='count', says=[cnt(comp_medals('p210', 'gold'))], tags=['constraint']))
add(T("when does anais cordvelle run next", 'competitor_next', {'competitor': 'p124'}, focus='when', says=[hm(next_contest('p124'))], tags=['diacritics']))
add(T("next race for thumard zevert?", 'competitor_next', {'competitor': 'p101'}, focus='when', says=[hm(next_contest('p101'))], tags=['terse']))
assert next_contest(WON) is None
add(T("when is galkace competing next", 'competitor_next', {'competitor': WON}, outcome='no_data', focus='when', tags=['partial']))
add(T("how did Zemim Guntasand do in the 200 fly", 'competitor_result', {'competitor': 'p083', 'contest': M200FL}, focus='how_did', says=[place_of(M200FL, 'p083'), mark_of(M200FL, 'p083')], tags=['exact']))
add(T("how did sondora hervoveth get on in the long jump", 'competitor_result', {'competitor': 'p166', 'contest': 'ath-w-long-jump-final'}, focus='how_did', says=[place_of('ath-w-long-jump-final', 'p166'), mark_of('ath-w-long-jump-final', 'p166')], tags=['chatty']))
add(T("who finished fourth in the mens 1500", 'contest_place', {'contest': 'ath-m-1500m-final', 'place': '4'}, focus='who', says=[ename(at_place('ath-m-1500m-final', 4)[0])], never=[ename(at_place('ath-m-1500m-final', 3)[0])], tags=['number_words']))
add(T("who came 5th in the women's floor", 'contest_place', {'contest': 'gym-w-floor-final', 'place': '5'}, focus='who', says=[ename(at_place('gym-w-floor-final', 5)[0])], tags=['constraint']))
add(T("full results mens road race", 'full_results', {'contest': 'cyc-m-road-race-final'}, focus='results', says=topn('cyc-m-road-race-final', 10), tags=['terse']))
add(T("give me the top 3 in the women's time trial", 'full_results', {'contest': 'cyc-w-time-trial-final', 'count': '3'}, focus='results', says=topn('cyc-w-time-trial-final', 3), never=[ename(at_place('cyc-w-time-trial-final', 4)[0])], tags=['constraint']))
add(T("when's the women's 100m final", 'contest_time', {'contest': W100}, focus='when', says=[hm(W100)], tags=['contraction']))
add(T("where is the women's vault final held", 'contest_time', {'contest': 'gym-w-vault-final'}, focus='where', says=[CONT['gym-w-vault-final']['venue']], tags=['exact']))
add(T("what time does the womens basketball final tip off", 'contest_time', {'contest': BKW}, focus='when', says=[hm(BKW)], tags=['chatty']))
add(T("what's the best long jump so far on the men's side", 'best_mark', {'discipline': 'athletics/long-jump', 'category': 'men'}, focus='mark', says=[best('long-jump', 'men')[1]], tags=['constraint']))
add(T("fastest 100m time by a woman at these games?", 'best_mark', {'discipline': 'athletics/100m', 'category': 'women'}, focus='mark', says=[best('100m', 'women')[1]], tags=['constraint']))
add(T("how did dunmerrow do in the mens basketball", 'delegation_in_event', {'group': 'dunmerrow', 'contest': BKM}, focus='how_did', says=[place_of(BKM, 'dunmerrow'), mark_of(BKM, 'dunmerrow')] and [place_of(BKM, 'dunmerrow')], tags=['exact']))
add(T("how did orrindel go in the men's basketball final", 'delegation_in_event', {'group': 'orrindel', 'contest': BKM}, focus='how_did', says=[place_of(BKM, 'orrindel')], tags=['alias']))
add(T("did brellmoor win the mens double sculls", 'delegation_in_event', {'group': 'brellmoor', 'contest': 'row-m-double-sculls-final'}, focus='whether', says=[place_of('row-m-double-sculls-final', 'brellmoor')], tags=['exact']))
h = lambda cid, a, b: name(a) if entry(cid, a)['place'] < entry(cid, b)['place'] else name(b)
add(T("who finished higher in the 200, Galkace or Dorrago", 'head_to_head', {'competitor': WON, 'rival': 'p013', 'contest': M200}, focus='compare', says=[h(M200, WON, 'p013')], tags=['partial']))
add(T("did bana gulelick beat modys missorn in the 200m", 'head_to_head', {'competitor': 'p131', 'rival': 'p130', 'contest': W200}, focus='whether', says=[h(W200, 'p131', 'p130')], tags=['exact']))
add(T("by how much did bronaline hervace win the 1500", 'competitor_margin', {'competitor': 'p141', 'contest': 'ath-w-1500m-final'}, focus='margin', says=[gap('ath-w-1500m-final', 'p141', 'p148')], tags=['exact']))
add(T("how far behind the winner was lirust dosavorn in the 100", 'competitor_margin', {'competitor': LIR, 'contest': M100}, focus='margin', says=[gap(M100, LIR, WON), name(WON)], tags=['partial']))
add(T("tell me about Stemelle Kovendal", 'competitor_profile', {'competitor': 'p184'}, focus='profile', says=[mark_of('swm-w-100m-breaststroke-final', 'p184')], tags=['exact']))
add(T("hi there", 'greeting', {}, focus='chat', tags=['chat']))
add(T("what can you do", 'help', {}, focus='chat', tags=['chat']))
add(T("cheers mate", 'thanks', {}, focus='chat', tags=['chat']))
# clarify / ambiguity
add(T("zoe results?", 'competitor_profile', {}, outcome='clarify', focus='profile', says=[name(p) for p in ZOES], tags=['ambiguous', 'diacritics', 'clarify']))
add(T("what did kovendal win", 'competitor_medals', {}, outcome='clarify', focus='count', says=[name(p) for p in KOV], tags=['ambiguous', 'partial', 'clarify']))
add(T("who won the 200 free", 'podium', {}, outcome='clarify', focus='who', says=['men', 'women'], tags=['ambiguous', 'missing_slot', 'clarify']))
add(T("who won silver", 'medalist', {'award': 'silver'}, outcome='clarify', focus='who', tags=['missing_slot', 'clarify']))
# no_data
add(T("who won the women's 100 metres", 'podium', {'contest': W100}, outcome='no_data', focus='who', never=[ename(at_place('ath-w-100m-heat-1', 1)[0]), ename(at_place('ath-w-100m-heat-2', 1)[0])], tags=['exact']))
add(T("results of the women's 400 IM", 'full_results', {'contest': 'swm-w-400m-individual-medley-final'}, outcome='no_data', focus='results', tags=['partial']))
add(T("who won the men's javelin", 'podium', {'contest': MJAV}, outcome='no_data', focus='who', tags=['exact', 'live']))
add(T("who won the men's pole vault", 'podium', {}, outcome='no_data', focus='who', never=[leader(MHJ)], tags=['exact', 'no_such_event']))
add(T("results of the women's 50m freestyle", 'full_results', {}, outcome='no_data', focus='results', never=medal('swm-w-100m-freestyle-final', 'gold'), tags=['no_such_event']))
# voice / mishearing
add(T("who won the men's two hundred meter butterfly", 'podium', {'contest': M200FL}, focus='who', says=medal(M200FL, 'gold'), tags=['voice', 'number_words']))
add(T("how many medals has hinaline hunt and hall won", 'competitor_medals', {'competitor': 'p186'}, focus='count', says=[cnt(comp_medals('p186'))], tags=['voice', 'mishearing']))
add(T("who is leading the womens all around", 'live_leader', {'contest': WAA}, focus='who', says=[leader(WAA)], tags=['voice']))
add(T("when does the key rocket race next", 'competitor_next', {'competitor': WON}, outcome='no_data', focus='when', tags=['voice', 'mishearing', 'alias']))
add(T("what delegation is krundina dovonasco on", 'competitor_delegation', {'competitor': 'p230'}, focus='group_of', says=[gname('orrindel')], tags=['voice', 'mishearing']))
add(T("how did issov fusty sessy do in the two hundred freestyle", 'competitor_result', {'competitor': 'p082', 'contest': 'swm-m-200m-freestyle-final'}, focus='how_did', says=[place_of('swm-m-200m-freestyle-final', 'p082'), mark_of('swm-m-200m-freestyle-final', 'p082')], tags=['voice', 'mishearing']))
add(T("whats on today in athletics", 'schedule_day', {'date': TODAY, 'sport': 'athletics'}, focus='schedule', says=[hm(c['id']) for c in day_contests(TODAY, 'athletics')], never=[hm(WAA)], tags=['voice', 'relative_day', 'constraint']))
add(T("medal count for zandrel reach", 'delegation_medals', {'group': 'zandrel'}, focus='count', says=[cnt(total(medals_table()['zandrel']))], tags=['exact']))
add(T("how many bronze medals has corvanthe won in athletics", 'delegation_medals', {'group': 'corvanthe', 'sport': 'athletics', 'award': 'bronze'}, focus='count', says=[cnt(medals_table(sport='athletics')['corvanthe']['bronze'])], tags=['constraint']))
add(T("top three in the gymnastics medal table", 'medal_table_top', {'sport': 'gymnastics', 'count': '3'}, focus='table', says=[gname(g) for g in ranked(sport='gymnastics')[0][:3]] if True else [], tags=['number_words', 'constraint']))
add(T("who has the most golds", 'medal_table_leader', {'award': 'gold'}, focus='who', says=table_leader(award='gold'), tags=['constraint']))
add(T("who came last in the womens marathon", 'contest_place', {'contest': 'ath-w-marathon-final', 'place': '9'}, focus='who', says=[ename(at_place('ath-w-marathon-final', 9)[0])], tags=['last']))
add(T("gold medal time in the men's 1500?", 'medalist', {'contest': 'ath-m-1500m-final', 'award': 'gold'}, focus='mark', says=[mark_of('ath-m-1500m-final', at_place('ath-m-1500m-final', 1)[0]['competitor'])], tags=['constraint']))
add(T("winning score in the men's basketball final", 'podium', {'contest': BKM, 'award': 'gold'}, focus='mark', says=[entry(BKM, 'dunmerrow')['mark']], tags=['alias']))
add(T("is the womens all-around finished yet", 'live_leader', {'contest': WAA}, focus='status', says=[leader(WAA)], tags=['status']))
add(T("has the mens basketball final finished", 'podium', {'contest': BKM}, focus='status', says=medal(BKM, 'gold'), tags=['status']))
add(T("best time in the 200 fly", 'best_mark', {'discipline': 'swimming/200m-butterfly'}, outcome='clarify', focus='mark', says=['men', 'women'], tags=['missing_slot', 'ambiguous', 'clarify']))
add(T("highest score on floor, men's", 'best_mark', {'discipline': 'gymnastics/floor', 'category': 'men'}, focus='mark', says=[best('floor', 'men')[1]], tags=['constraint']))
add(T("Did Wanard Sindayne get a medal", 'competitor_medals', {'competitor': 'p090'}, focus='whether', says=[cnt(comp_medals('p090'))] and ['silver'], tags=['exact']))
add(T("was thindust zavindal quicker than wanard sindayne", 'head_to_head', {'competitor': 'p088', 'rival': 'p090'}, focus='compare', says=[h('row-m-single-sculls-final', 'p088', 'p090')], tags=['exact']))
add(T("what were the results in the men's 100m heat 2", 'full_results', {'contest': 'ath-m-100m-heat-2'}, focus='results', says=topn('ath-m-100m-heat-2', 3), tags=['constraint', 'round']))
add(T("who won heat 1 of the women's 100", 'contest_place', {'contest': 'ath-w-100m-heat-1', 'place': '1'}, focus='who', says=[ename(at_place('ath-w-100m-heat-1', 1)[0])], never=[ename(at_place('ath-w-100m-heat-2', 1)[0])], tags=['constraint', 'round']))
add(T("fastest men's 100 in the heats", 'best_mark', {'discipline': 'athletics/100m', 'category': 'men', 'round': 'heat'}, focus='mark', says=[min((fmt(c, e['mark']) for c in ('ath-m-100m-heat-1', 'ath-m-100m-heat-2') for e in CONT[c]['entries']), key=lambda m: secs(m[:-2]))], never=[best('100m', 'men')[1]], tags=['constraint', 'round']))
# uncovered singles
add(U("what's the weather like at the harbour loop", tags=['chatty']))
add(U("is galkace injured?", tags=['partial']))
add(U("how old is tetha brelwick"))
add(U("what channel is the gymnastics on"))
add(U("how tall is lomov kerreth"))
add(U("where can i buy tickets for the basketball final"))
add(U("was that a games record in the javelin", focus='other'))
add(U("who is the flag bearer for orrindel"))
add(U("how many points did big tobi score in the final", never=[entry(BKM, 'zandrel')['mark']], tags=['alias']))
add(U("what were the splits at halfway in the men's marathon", never=[leader(MMAR)]))
add(U("how many medals has kalvenmark won in women's events", never=[cnt(total(kv))] if total(kv) < 10 else [str(total(kv))], tags=['constraint']))
add(U("who is going to win the women's 100m tomorrow", focus='who', never=[ename(at_place('ath-w-100m-heat-1', 1)[0])], tags=['prediction']))
add(U("who coaches the dunmerrow basketball team"))
add(U("how much prize money does a gold medal get"))
add(U("fastest swimmer across all events, men or women", focus='mark'))
add(U("how many world records have fallen at these games"))
add(U("has anyone failed a drugs test"))
add(U("whats the population of quessary"))
add(U("can you show me a replay of the basketball final"))
add(U("how many medals did kalvenmark win at the last games", never=[cnt(total(kv)) if total(kv) < 10 else str(total(kv))], tags=['constraint']))
add(U("what lane was galkace in for the 100 final", tags=['partial']))
add(U("who lit the cauldron at the opening ceremony"))
add(U("purple monkey dishwasher", focus='other', outcome='not_understood', tags=['gibberish']))
add(U("asdfgh jkl", focus='other', outcome='not_understood', tags=['gibberish']))
add(U("can you book me a table for two at 8", focus='other', outcome='not_understood', tags=['off_topic']))

# ============================== conversations
add(CONV(
    T("who won the 100m men's final", 'podium', {'contest': M100}, focus='who', says=medal(M100, 'gold'), tags=['exact']),
    T("and silver?", 'medalist', {'contest': M100, 'award': 'silver'}, focus='who', says=medal(M100, 'silver'), never=medal(M100, 'gold'), tags=['follow_up', 'ellipsis']),
    T("what was his time", 'competitor_result', {'competitor': LIR, 'contest': M100}, focus='mark', says=[mark_of(M100, LIR)], tags=['follow_up', 'pronoun']),
    T("thanks", 'thanks', {}, focus='chat', tags=['chat'])), )
add(CONV(
    T("how did zoe get on", 'competitor_profile', {}, outcome='clarify', focus='profile', says=[name(p) for p in ZOES], tags=['ambiguous', 'clarify']),
    T("the swimmer", 'competitor_profile', {'competitor': 'p196'}, focus='profile', says=[mark_of(W200FR, 'p196')], tags=['follow_up', 'clarify_answer']),
    T("how many medals is that", 'competitor_medals', {'competitor': 'p196'}, focus='count', says=[cnt(comp_medals('p196'))], tags=['follow_up', 'pronoun']),
    T("when is she in the pool next", 'competitor_next', {'competitor': 'p196'}, focus='when', says=[hm(next_contest('p196'))], tags=['follow_up', 'pronoun'])), )
add(CONV(
    T("zoe marrant how did she do", 'competitor_profile', {'competitor': 'p199'}, focus='profile', says=[place_of('row-w-single-sculls-final', 'p199')], tags=['diacritics']),
    T("who won that race", 'podium', {'contest': 'row-w-single-sculls-final'}, focus='who', says=medal('row-w-single-sculls-final', 'gold'), tags=['follow_up', 'pronoun']),
    T("by how much did she lose out on bronze", 'none', outcome='not_covered', focus='margin', tags=['uncovered', 'follow_up'])) if False else CONV(
    T("zoe marrant how did she do", 'competitor_profile', {'competitor': 'p199'}, focus='profile', says=[place_of('row-w-single-sculls-final', 'p199')], tags=['diacritics']),
    T("who won that race", 'podium', {'contest': 'row-w-single-sculls-final'}, focus='who', says=medal('row-w-single-sculls-final', 'gold'), tags=['follow_up', 'pronoun']),
    T("and how far back was marrant from her", 'competitor_margin', {'competitor': 'p199', 'contest': 'row-w-single-sculls-final'}, focus='margin', says=[gap('row-w-single-sculls-final', 'p199', 'p202')], tags=['follow_up', 'pronoun'])))
add(CONV(
    T("whats live now", 'under_way', {}, focus='schedule', says=[SPORTS[CONT[c]['sport']]['disciplines'][[d['id'] for d in SPORTS[CONT[c]['sport']]['disciplines']].index(CONT[c]['discipline'])]['name'] for c in live()], tags=['terse']),
    T("who's winning the marathon", 'live_leader', {'contest': MMAR}, focus='who', says=[leader(MMAR)], tags=['follow_up']),
    T("what's the gap to second", 'live_leader', {'contest': MMAR}, focus='margin', says=[ename(at_place(MMAR, 2)[0])], tags=['follow_up', 'ellipsis']),
    T("how many km have they run", tags=None) if False else U("how many kilometres have they done so far", tags=['follow_up']),
    T("and the javelin?", 'live_leader', {'contest': MJAV}, focus='who', says=[leader(MJAV)], tags=['follow_up', 'ellipsis'])))
add(CONV(
    T("medal table please", 'medal_table_top', {}, focus='table', says=[lead_t], tags=['terse']),
    T("just swimming", 'medal_table_top', {'sport': 'swimming'}, focus='table', says=[gname(g) for g in ranked(sport='swimming')[0][:1]], tags=['follow_up', 'constraint']),
    T("and only golds", 'medal_table_top', {'sport': 'swimming', 'award': 'gold'}, focus='table', says=table_leader(sport='swimming', award='gold'), tags=['follow_up', 'constraint']),
    T("ok where is halvorne overall", 'delegation_medals', {'group': 'halvorne'}, focus='rank', says=[group_rank('halvorne')], tags=['new_question'])))
add(CONV(
    T("how many medals for orrindel isles", 'delegation_medals', {'group': 'orrindel'}, focus='count', says=[str(total(medals_table()['orrindel'])) if total(medals_table()['orrindel']) >= 10 else cnt(total(medals_table()['orrindel']))], tags=['exact']),
    T("how many of those are gold", 'delegation_medals', {'group': 'orrindel', 'award': 'gold'}, focus='count', says=[cnt(medals_table()['orrindel']['gold'])], tags=['follow_up', 'pronoun']),
    T("and how many in basketball", 'delegation_medals', {'group': 'orrindel', 'sport': 'basketball'}, focus='count', says=[cnt(total(medals_table(sport='basketball')['orrindel']))], tags=['follow_up', 'constraint']),
    T("how many rebounds did they get in that game", tags=None) if False else U("how many rebounds did they get in that game", tags=['follow_up'])))
add(CONV(
    T("hello", 'greeting', {}, focus='chat', tags=['chat']),
    T("who won the women's road race", 'podium', {'contest': 'cyc-w-road-race-final'}, focus='who', says=medal('cyc-w-road-race-final', 'gold'), tags=['exact']),
    T("did she win the time trial too", 'podium', {'contest': 'cyc-w-time-trial-final'}, focus='whether', says=medal('cyc-w-time-trial-final', 'gold'), tags=['follow_up', 'pronoun']),
    T("whats her winning margin there", 'competitor_margin', {'competitor': 'p210', 'contest': 'cyc-w-time-trial-final'}, focus='margin', says=[gap('cyc-w-time-trial-final', 'p210', 'p218')], tags=['follow_up', 'pronoun']),
    T("ta", 'thanks', {}, focus='chat', tags=['chat'])))
add(CONV(
    T("when's the women's high jump", 'contest_time', {'contest': 'ath-w-high-jump-final'}, focus='when', says=[hm('ath-w-high-jump-final')], tags=['contraction']),
    T("where", 'contest_time', {'contest': 'ath-w-high-jump-final'}, focus='where', says=[CONT['ath-w-high-jump-final']['venue']], tags=['follow_up', 'ellipsis']),
    T("and the men's one, who's leading it", 'live_leader', {'contest': MHJ}, focus='who', says=[leader(MHJ)], tags=['follow_up', 'pronoun']),
    T("what height is he on", 'live_leader', {'contest': MHJ}, focus='mark', says=[fmt(MHJ, at_place(MHJ, 1)[0]['mark'])], tags=['follow_up', 'pronoun'])))
add(CONV(
    T("tell me about wonorin galkace", 'competitor_profile', {'competitor': WON}, focus='profile', says=[mark_of(M100, WON), mark_of(M200, WON)], tags=['exact']),
    T("which delegation", 'competitor_delegation', {'competitor': WON}, focus='group_of', says=[gname('quessary')], tags=['follow_up', 'ellipsis']),
    T("what's his personal best in the 100", tags=None) if False else U("what's his lifetime best in the 100", tags=['follow_up', 'pronoun']),
    T("did he beat dorrago in the 100 final", 'head_to_head', {'competitor': WON, 'rival': 'p013', 'contest': M100}, focus='whether', says=[h(M100, WON, 'p013')], tags=['follow_up', 'pronoun'])))
add(CONV(
    T("who won the 200 fly", 'podium', {}, outcome='clarify', focus='who', says=['men', 'women'], tags=['ambiguous', 'clarify']),
    T("womens", 'podium', {'contest': W200FL}, focus='who', says=medal(W200FL, 'gold'), tags=['clarify_answer']),
    T("and the mens", 'podium', {'contest': M200FL}, focus='who', says=medal(M200FL, 'gold'), never=medal(W200FL, 'gold'), tags=['follow_up', 'ellipsis'])))
add(CONV(
    T("how did kovendal do", 'competitor_profile', {}, outcome='clarify', focus='profile', says=[name(p) for p in KOV], tags=['ambiguous', 'clarify']),
    T("the rower", 'competitor_profile', {'competitor': 'p084'}, focus='profile', says=[place_of('row-m-single-sculls-final', 'p084')], tags=['clarify_answer']),
    T("who beat him", 'competitor_margin', {'competitor': 'p084', 'contest': 'row-m-single-sculls-final'}, focus='who', says=medal('row-m-single-sculls-final', 'gold'), tags=['follow_up', 'pronoun'])))
add(CONV(
    T("what's on tomorrow in swimming", 'schedule_day', {'date': TOMORROW, 'sport': 'swimming'}, focus='schedule', says=[hm('swm-w-400m-individual-medley-final')], never=[hm(W100)], tags=['relative_day', 'constraint']),
    T("who is swimming in it", 'full_results', {'contest': 'swm-w-400m-individual-medley-final'}, focus='results', says=all_names('swm-w-400m-individual-medley-final')[:3], tags=['follow_up', 'pronoun']),
    T("where is it", 'contest_time', {'contest': 'swm-w-400m-individual-medley-final'}, focus='where', says=[CONT['swm-w-400m-individual-medley-final']['venue']], tags=['follow_up', 'pronoun']),
    U("is there parking near there", tags=['follow_up'])))
add(CONV(
    T("whats on today", 'schedule_day', {'date': TODAY}, focus='schedule', says=[hm(c['id']) for c in day_contests(TODAY)], tags=['relative_day']),
    T("what about yesterday", 'schedule_day', {'date': YESTERDAY}, focus='schedule', says=[hm(M100)], tags=['relative_day', 'follow_up']),
    T("who won the men's 1500 then", 'podium', {'contest': 'ath-m-1500m-final'}, focus='who', says=medal('ath-m-1500m-final', 'gold'), tags=['new_question']),
    T("and the long jump for women", 'podium', {'contest': 'ath-w-long-jump-final'}, focus='who', says=medal('ath-w-long-jump-final', 'gold'), tags=['follow_up'])))
add(CONV(
    T("who leads the medal table", 'medal_table_leader', {}, focus='who', says=[lead_t], tags=['exact']),
    T("how many golds do they have", 'delegation_medals', {'group': ranked()[0][0], 'award': 'gold'}, focus='count', says=[cnt(ranked()[1][ranked()[0][0]]['gold'])], tags=['follow_up', 'pronoun']),
    T("and who's second", 'medal_table_top', {'count': '2'}, focus='table', says=second_t, tags=['follow_up', 'tie']),
    T("who leads on today's medals only", 'medal_table_leader', {'date': TODAY}, focus='who', says=table_leader(date=TODAY), tags=['relative_day', 'constraint'])))
add(CONV(
    T("hey can u tell me who got bronze in the womens 400", 'medalist', {'contest': 'ath-w-400m-final', 'award': 'bronze'}, focus='who', says=medal('ath-w-400m-final', 'bronze'), tags=['chatty', 'contraction']),
    T("what happened to drada brorrorn", 'competitor_result', {'competitor': 'p139', 'contest': 'ath-w-400m-final'}, focus='how_did', never=['8th'], tags=['new_question']),
    U("why was she disqualified", tags=['follow_up', 'pronoun'])))
add(CONV(
    T("how many medals has hothic nuvasko won", 'competitor_medals', {'competitor': 'p072'}, focus='count', says=[cnt(comp_medals('p072'))], tags=['exact']),
    T("how many golds", 'competitor_medals', {'competitor': 'p072', 'award': 'gold'}, focus='count', says=[cnt(comp_medals('p072', 'gold'))], tags=['follow_up', 'ellipsis']),
    T("thanks!", 'thanks', {}, focus='chat', tags=['thanks_between']),
    T("and what about zemim guntasand", 'competitor_medals', {'competitor': 'p083'}, focus='count', says=[cnt(comp_medals('p083'))], tags=['follow_up'])))
add(CONV(
    T("who was fifth in the men's 100 final", 'contest_place', {'contest': M100, 'place': '5'}, focus='who', says=[ename(at_place(M100, 5)[0])], tags=['exact']),
    T("and sixth", 'contest_place', {'contest': M100, 'place': '6'}, focus='who', says=[ename(at_place(M100, 6)[0])], never=[ename(at_place(M100, 5)[0])], tags=['follow_up', 'ellipsis']),
    T("what country is he from", 'competitor_delegation', {'competitor': at_place(M100, 6)[0]['competitor']}, focus='group_of', says=[gname(COMP[at_place(M100, 6)[0]['competitor']]['group'])], tags=['follow_up', 'pronoun'])))
add(CONV(
    T("men's basketball final result?", 'podium', {'contest': BKM}, focus='results', says=medal(BKM, 'gold'), tags=['alias']),
    T("what was the score", 'full_results', {'contest': BKM}, focus='mark', says=[entry(BKM, 'dunmerrow')['mark'], entry(BKM, 'zandrel')['mark']], tags=['follow_up']),
    U("who was mvp", tags=['follow_up']),
    T("when's the women's final", 'contest_time', {'contest': BKW}, focus='when', says=[hm(BKW)], tags=['follow_up'])))
add(CONV(
    T("how did pellavia do in the men's high jump", 'delegation_in_event', {'group': 'pellavia', 'contest': MHJ}, focus='how_did', says=[name('p053')], tags=['exact']),
    T("is he still in front", 'live_leader', {'contest': MHJ}, focus='whether', says=[leader(MHJ)], tags=['follow_up', 'pronoun']),
    U("how many attempts has he got left", tags=['follow_up', 'pronoun'])))
add(CONV(
    T("who won gold in the mens 400", 'medalist', {'contest': 'ath-m-400m-final', 'award': 'gold'}, focus='who', says=medal('ath-m-400m-final', 'gold'), tags=['exact']),
    T("by how much", 'competitor_margin', {'competitor': 'p023', 'contest': 'ath-m-400m-final'}, focus='margin', says=[gap('ath-m-400m-final', 'p023', 'p020')], tags=['follow_up', 'ellipsis']),
    T("what's his medal count at these games", 'competitor_medals', {'competitor': 'p023'}, focus='count', says=[cnt(comp_medals('p023'))], tags=['follow_up', 'pronoun'])))
add(CONV(
    T("javelin results", 'full_results', {}, outcome='clarify', focus='results', says=['men', 'women'], tags=['ambiguous', 'clarify']),
    T("the women's", 'full_results', {'contest': 'ath-w-javelin-final'}, focus='results', says=topn('ath-w-javelin-final', 3), tags=['clarify_answer']),
    T("who was 4th", 'contest_place', {'contest': 'ath-w-javelin-final', 'place': '4'}, focus='who', says=[ename(at_place('ath-w-javelin-final', 4)[0])], tags=['follow_up'])))
add(CONV(
    T("whats the best mens high jump so far in the games", 'best_mark', {'discipline': 'athletics/high-jump', 'category': 'men'}, focus='mark', says=[best('high-jump')[1]], tags=['exact']),
    U("is that a world lead", tags=['follow_up', 'pronoun']),
    T("who jumped it", 'best_mark', {'discipline': 'athletics/high-jump', 'category': 'men'}, focus='who', says=[best('high-jump')[2]], tags=['follow_up', 'pronoun'])))
add(CONV(
    T("lomov kerreth - what sport?", 'competitor_sport', {'competitor': 'p053'}, focus='sport_of', says=['athletics', 'high jump'], tags=['terse']),
    T("is he winning", 'live_leader', {'contest': MHJ}, focus='whether', says=[leader(MHJ)], tags=['follow_up', 'pronoun']),
    T("who's second", 'contest_place', {'contest': MHJ, 'place': '2'}, focus='who', says=[ename(at_place(MHJ, 2)[0])], tags=['follow_up'])))
add(CONV(
    T("who won the double sculls", 'podium', {}, outcome='clarify', focus='who', says=['men', 'women'], tags=['ambiguous', 'clarify']),
    T("the men", 'podium', {'contest': 'row-m-double-sculls-final'}, focus='who', says=medal('row-m-double-sculls-final', 'gold'), tags=['clarify_answer']),
    T("who rowed for them", 'full_results', {'contest': 'row-m-double-sculls-final'}, focus='who', says=[name(p) for p in entry('row-m-double-sculls-final', 'brellmoor')['members']], tags=['follow_up', 'pronoun']),
    T("and when is the women's double", 'contest_time', {'contest': 'row-w-double-sculls-final'}, focus='when', says=[hm('row-w-double-sculls-final')], tags=['follow_up'])))
add(CONV(
    T("quick one: what does rhea maud ocarrowin compete in", 'competitor_sport', {'competitor': 'p159'}, focus='sport_of', says=['athletics', 'long jump'], tags=['diacritics', 'chatty']),
    T("how did she finish", 'competitor_result', {'competitor': 'p159', 'contest': 'ath-w-long-jump-final'}, focus='how_did', says=[place_of('ath-w-long-jump-final', 'p159'), mark_of('ath-w-long-jump-final', 'p159')], tags=['follow_up', 'pronoun']),
    T("did she beat othora paland", 'head_to_head', {'competitor': 'p159', 'rival': 'p160', 'contest': 'ath-w-long-jump-final'}, focus='whether', says=[h('ath-w-long-jump-final', 'p159', 'p160')], tags=['follow_up', 'pronoun'])))
add(CONV(
    T("yo", 'greeting', {}, focus='chat', tags=['chat']),
    T("what can i ask u", 'help', {}, focus='chat', tags=['chat']),
    T("ok who won the men's road race", 'podium', {'contest': 'cyc-m-road-race-final'}, focus='who', says=medal('cyc-m-road-race-final', 'gold'), tags=['exact']),
    U("what gear ratio was he running", tags=['follow_up', 'pronoun'])))
add(CONV(
    T("whos leading the women's all around", 'live_leader', {'contest': WAA}, focus='who', says=[leader(WAA)], tags=['exact']),
    T("by how many points", 'live_leader', {'contest': WAA}, focus='margin', says=[gap(WAA, 'p230', 'p229')], tags=['follow_up', 'ellipsis']),
    T("how's comia tamoss doing", 'competitor_result', {'competitor': 'p223', 'contest': WAA}, focus='how_did', says=[place_of(WAA, 'p223')], tags=['follow_up']),
    U("which apparatus are they on now", tags=['follow_up'])))
add(CONV(
    T("how many medals have dunmerrow won", 'delegation_medals', {'group': 'dunmerrow'}, focus='count', says=[cnt(total(medals_table()['dunmerrow'])) if total(medals_table()['dunmerrow']) < 10 else str(total(medals_table()['dunmerrow']))], tags=['exact']),
    T("where does that put them", 'delegation_medals', {'group': 'dunmerrow'}, focus='rank', says=[group_rank('dunmerrow')], tags=['follow_up', 'pronoun']),
    T("and in cycling", 'delegation_medals', {'group': 'dunmerrow', 'sport': 'cycling'}, focus='count', says=[cnt(total(medals_table(sport='cycling')['dunmerrow']))], tags=['follow_up', 'constraint'])))
add(CONV(
    T("who won the metric mile for women", 'podium', {'contest': 'ath-w-1500m-final'}, focus='who', says=medal('ath-w-1500m-final', 'gold'), tags=['alias']),
    T("what was her time", 'competitor_result', {'competitor': 'p141', 'contest': 'ath-w-1500m-final'}, focus='mark', says=[mark_of('ath-w-1500m-final', 'p141')], tags=['follow_up', 'pronoun']),
    T("how about cenna dulvaire", 'competitor_result', {'competitor': 'p140', 'contest': 'ath-w-1500m-final'}, focus='how_did', says=[place_of('ath-w-1500m-final', 'p140'), mark_of('ath-w-1500m-final', 'p140')], tags=['follow_up', 'diacritics'])))
add(CONV(
    T("schedule for tuesday", 'schedule_day', {'date': '2027-08-17'}, focus='schedule', says=[hm(c['id']) for c in day_contests('2027-08-17')], tags=['relative_day']),
    T("only basketball", 'schedule_day', {'date': '2027-08-17', 'sport': 'basketball'}, focus='schedule', says=[hm(BKW)], never=[hm('cyc-m-time-trial-final')], tags=['follow_up', 'constraint']),
    T("who's playing in that", 'full_results', {'contest': BKW}, focus='results', says=all_names(BKW), tags=['follow_up', 'pronoun'])))
add(CONV(
    T("how did the quay rocket do in the 200", 'competitor_result', {'competitor': WON, 'contest': M200}, focus='how_did', says=[place_of(M200, WON), mark_of(M200, WON)], tags=['alias']),
    T("and in the 100 heats", 'competitor_result', {'competitor': WON, 'contest': 'ath-m-100m-heat-1'}, focus='how_did', says=[place_of('ath-m-100m-heat-1', WON), mark_of('ath-m-100m-heat-1', WON)], tags=['follow_up', 'round']),
    T("cheers. whos top of the table", 'medal_table_leader', {}, focus='who', says=[lead_t], tags=['thanks_between', 'new_question'])))
add(CONV(
    T("who won bronze in the women's 200 free", 'medalist', {'contest': W200FR, 'award': 'bronze'}, outcome='no_data', focus='who', never=[ename(at_place(W200FR, 4)[0])], tags=['tie']),
    T("so who got silver", 'medalist', {'contest': W200FR, 'award': 'silver'}, focus='who', says=medal(W200FR, 'silver'), tags=['follow_up']),
    T("what was the time", 'full_results', {'contest': W200FR}, focus='mark', says=[mark_of(W200FR, 'p196')], tags=['follow_up'])))
add(CONV(
    T("is the marathon still going", 'live_leader', {'contest': MMAR}, focus='status', says=[leader(MMAR)], tags=['status']),
    T("who won the women's one", 'podium', {'contest': 'ath-w-marathon-final'}, focus='who', says=medal('ath-w-marathon-final', 'gold'), tags=['follow_up', 'pronoun']),
    T("what was the winning time", 'competitor_result', {'competitor': 'p153', 'contest': 'ath-w-marathon-final'}, focus='mark', says=[mark_of('ath-w-marathon-final', 'p153')], tags=['follow_up']),
    U("what was the temperature during that race", tags=['follow_up'])))
add(CONV(
    T("top 10 medal table", 'medal_table_top', {'count': '10'}, focus='table', says=[gname(g) for g in ranked()[0][:3]], tags=['exact']),
    T("who has most silvers", 'medal_table_leader', {'award': 'silver'}, focus='who', says=table_leader(award='silver'), tags=['new_question', 'constraint', 'tie']),
    U("and which country has won the most medals per head of population", tags=['follow_up'])))
add(CONV(
    T("what delegation is big tobi with", 'competitor_delegation', {'competitor': 'p253'}, focus='group_of', says=[gname('zandrel')], tags=['alias']),
    T("did his team win", 'delegation_in_event', {'group': 'zandrel', 'contest': BKM}, focus='whether', says=[place_of(BKM, 'zandrel')], tags=['follow_up', 'pronoun']),
    T("who beat them", 'podium', {'contest': BKM, 'award': 'gold'}, focus='who', says=medal(BKM, 'gold'), tags=['follow_up', 'pronoun'])))
add(CONV(
    T("kalvenmark in the women's single sculls?", 'delegation_in_event', {'group': 'kalvenmark', 'contest': 'row-w-single-sculls-final'}, focus='how_did', says=[name('p202')], tags=['terse']),
    T("by what margin", 'competitor_margin', {'competitor': 'p202', 'contest': 'row-w-single-sculls-final'}, focus='margin', says=[gap('row-w-single-sculls-final', 'p202', 'p204')], tags=['follow_up', 'ellipsis']),
    U("what boat manufacturer does she use", tags=['follow_up'])))
add(CONV(
    T("who won the mens floor", 'podium', {'contest': 'gym-m-floor-final'}, focus='who', says=medal('gym-m-floor-final', 'gold'), tags=['exact']),
    T("what did he score", 'competitor_result', {'competitor': 'p109', 'contest': 'gym-m-floor-final'}, focus='mark', says=[mark_of('gym-m-floor-final', 'p109')], tags=['follow_up', 'pronoun']),
    T("and hanel zilkedorn, how many medals total", 'competitor_medals', {'competitor': 'p114'}, focus='count', says=[cnt(comp_medals('p114'))], tags=['new_question']),
    T("thx", 'thanks', {}, focus='chat', tags=['chat'])))
add(CONV(
    T("when does tenora terrdal compete next", 'competitor_next', {'competitor': 'p224'}, focus='when', says=[hm(next_contest('p224'))], tags=['exact']),
    T("in what", 'competitor_next', {'competitor': 'p224'}, focus='sport_of', says=['vault'], tags=['follow_up', 'ellipsis']),
    T("where's that", 'contest_time', {'contest': next_contest('p224')}, focus='where', says=[CONT[next_contest('p224')]['venue']], tags=['follow_up', 'pronoun'])))
add(CONV(
    T("mens 100 m heat one results", 'full_results', {'contest': 'ath-m-100m-heat-1'}, focus='results', says=topn('ath-m-100m-heat-1', 3), tags=['round', 'number_words']),
    T("who was fastest over both heats", 'best_mark', {'discipline': 'athletics/100m', 'category': 'men', 'round': 'heat'}, focus='who', says=[ename(min([e for c in ('ath-m-100m-heat-1', 'ath-m-100m-heat-2') for e in CONT[c]['entries']], key=lambda e: secs(e['mark'])))], tags=['follow_up', 'round']),
    U("what was the wind reading in heat two", tags=['follow_up', 'round'])))
add(CONV(
    T("what sport is onov sarromell", 'competitor_sport', {'competitor': 'p079'}, focus='sport_of', says=['swimming'], tags=['exact']),
    T("did he beat jorund halmvik in the 100 free", 'head_to_head', {'competitor': 'p079', 'rival': 'p069', 'contest': 'swm-m-100m-freestyle-final'}, focus='whether', says=[h('swm-m-100m-freestyle-final', 'p079', 'p069')], tags=['follow_up', 'pronoun', 'diacritics']),
    T("and in the 200 free", 'head_to_head', {'competitor': 'p079', 'rival': 'p069', 'contest': 'swm-m-200m-freestyle-final'}, focus='compare', says=[h('swm-m-200m-freestyle-final', 'p079', 'p069')], tags=['follow_up', 'ellipsis'])))
add(CONV(
    T("good evening! who's ahead in the javelin", 'live_leader', {'contest': MJAV}, focus='who', says=[leader(MJAV)], tags=['chatty']),
    T("how far has he thrown", 'live_leader', {'contest': MJAV}, focus='mark', says=[fmt(MJAV, at_place(MJAV, 1)[0]['mark'])], tags=['follow_up', 'pronoun']),
    T("who's in third", 'contest_place', {'contest': MJAV, 'place': '3'}, focus='who', says=[ename(at_place(MJAV, 3)[0])], tags=['follow_up']),
    T("what about the women's javelin, who won it", 'podium', {'contest': 'ath-w-javelin-final'}, focus='who', says=medal('ath-w-javelin-final', 'gold'), tags=['follow_up'])))
add(CONV(
    T("how are welkmarsh doing in the medals", 'delegation_medals', {'group': 'welkmarsh'}, focus='count', says=[cnt(total(medals_table()['welkmarsh']))] if total(medals_table()['welkmarsh']) else None, never=[lead_t], tags=['chatty', 'no_medals']),
    U("how many athletes did they bring", tags=['follow_up', 'pronoun']),
    T("how did they do in the men's double sculls", 'delegation_in_event', {'group': 'welkmarsh', 'contest': 'row-m-double-sculls-final'}, focus='how_did', says=[place_of('row-m-double-sculls-final', 'welkmarsh')], tags=['follow_up', 'pronoun'])))
add(CONV(
    T("when is the mens time trial", 'contest_time', {'contest': 'cyc-m-time-trial-final'}, focus='when', says=[hm('cyc-m-time-trial-final')], tags=['exact']),
    T("where", 'contest_time', {'contest': 'cyc-m-time-trial-final'}, focus='where', says=[CONT['cyc-m-time-trial-final']['venue']], tags=['follow_up', 'ellipsis']),
    U("how long is the course", tags=['follow_up'])))
add(CONV(
    T("um hi who won the women's 200 metres", 'podium', {'contest': W200}, focus='who', says=medal(W200, 'gold'), tags=['voice', 'chatty']),
    T("who was fourth in it", 'contest_place', {'contest': W200, 'place': '4'}, focus='who', says=[ename(at_place(W200, 4)[0])], tags=['voice', 'follow_up', 'pronoun']),
    T("how far behind the winner was she", 'competitor_margin', {'competitor': 'p126', 'contest': W200}, focus='margin', says=[gap(W200, 'p126', 'p131')], tags=['voice', 'follow_up', 'pronoun'])))
add(CONV(
    T("who got the most medals today", 'most_medals', {'date': TODAY}, focus='who', says=most_medals(date=TODAY)[0], tags=['relative_day', 'tie']),
    T("show me today's medal table then", 'medal_table_top', {'date': TODAY}, focus='table', says=[gname(g) for g in ranked(date=TODAY)[0]], tags=['follow_up', 'relative_day']),
    U("when is the closing ceremony", tags=['new_question'])))

# ---------------------------------------------------------------- write
def turns():
    for c in cases:
        if 'conversation' in c:
            for t in c['conversation']: yield t
        else: yield c
def clean(d):
    # drop empty says/never lists
    for k in ('says', 'never'):
        if k in d and not d[k]: del d[k]
        elif k in d: d[k] = [s for s in d[k] if s]
    return d
for t in turns(): clean(t)
ts = list(turns())
n = len(ts); convs = [c for c in cases if 'conversation' in c]
unc = sum(1 for t in ts if t['outcome'] in ('not_covered', 'not_understood'))
for c in convs: assert 2 <= len(c['conversation']) <= 6
allowed = {'ask', 'intent', 'slots', 'outcome', 'focus', 'says', 'never', 'tags'}
for t in ts: assert set(t) <= allowed, t
out = os.path.join(HERE, 'games.yaml')
with open(out, 'w', encoding='utf-8') as f:
    f.write('# Blind question set, scenario: games\n# Moment: Saturday 14 August 2027 21:10 Europe/Lisbon (+01:00); data as of 21:04\n# Written by tests/eval/blind/round2/label_games.py (facts computed from dataset-demo/games/)\n')
    yaml.safe_dump(cases, f, allow_unicode=True, sort_keys=False, width=1000)
from collections import Counter
print('turns', n, 'conversations', len(convs), 'single', len(cases) - len(convs))
print('uncovered', unc, '%.1f%%' % (100 * unc / n))
print('by outcome', dict(Counter(t['outcome'] for t in ts)))
print('by intent', dict(Counter(t['intent'] for t in ts)))
