#!/usr/bin/env python3
"""Label the round-5 blind set for the games scenario from the demo data.

Every fact in `says` / `never` is computed from dataset-demo/games/*.json.
Moment: Saturday 14 August 2027, 21:10 +01:00 (data as of 21:04).
Writes games.yaml next to this script.
"""
import collections
import datetime
import json
import os

import yaml

HERE = os.path.dirname(os.path.abspath(__file__))
DATA = os.path.normpath(os.path.join(HERE, '..', '..', '..', '..', 'dataset-demo', 'games'))


def load(name):
    with open(os.path.join(DATA, name), encoding='utf-8') as f:
        return json.load(f)


COMP = {c['id']: c for c in load('competitors.json')}
CONTESTS = load('contests.json')
CON = {c['id']: c for c in CONTESTS}
GROUPS = {g['id']: g for g in load('groups.json')}
SPORTS = {s['id']: s for s in load('sports.json')}
SCEN = load('scenario.json')
CLOCK = datetime.datetime.fromisoformat(SCEN['clock'])
TODAY = CLOCK.date()
TOMORROW = TODAY + datetime.timedelta(days=1)
YESTERDAY = TODAY - datetime.timedelta(days=1)
AWARDS = ['gold', 'silver', 'bronze']
WORDS = ['zero', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine']


# ---------------------------------------------------------------- helpers
def iso(d):
    return d.isoformat()


def weekday(name, past):
    """The nearest day with that weekday name before (past) or after today."""
    step = -1 if past else 1
    d = TODAY + datetime.timedelta(days=step)
    while d.strftime('%A').lower() != name.lower():
        d += datetime.timedelta(days=step)
    return d


def count(n):
    return WORDS[n] if n < 10 else str(n)


def ordinal(n):
    suf = 'th' if 10 <= n % 100 <= 20 else {1: 'st', 2: 'nd', 3: 'rd'}.get(n % 10, 'th')
    return f'{n}{suf}'


def nm(pid):
    c = COMP[pid]
    return f"{c['given']} {c['family']}"


def gn(gid):
    return GROUPS[gid]['name']


def grp_of(pid):
    return COMP[pid]['group']


def entry_name(e):
    return nm(e['competitor']) if 'competitor' in e else gn(e['group'])


def fmt(cid, mark):
    c = CON[cid]
    if c['measure'] == 'time':
        return mark if ':' in mark else f'{mark} s'
    if c['measure'] == 'distance':
        return f'{mark} m'
    return mark


def secs(mark):
    parts = [float(x) for x in mark.split(':')]
    v = 0.0
    for p in parts:
        v = v * 60 + p
    return v


def diff(cid, a, b):
    c = CON[cid]
    if c['measure'] == 'time':
        d = abs(secs(a) - secs(b))
        assert d < 60 and '.' in a
        return f'{d:.2f} s'
    d = abs(float(a) - float(b))
    if c['measure'] == 'distance':
        return f'{d:.2f} m'
    dec = len(a.split('.')[1]) if '.' in a else 0
    return f'{d:.{dec}f}'


def entry(cid, who):
    for e in CON[cid]['entries']:
        if e.get('competitor') == who or e.get('group') == who or who in e.get('members', []):
            return e
    raise KeyError((cid, who))


def placed(cid):
    return sorted([e for e in CON[cid]['entries'] if 'place' in e], key=lambda e: e['place'])


def at_place(cid, n):
    r = [entry_name(e) for e in placed(cid) if e['place'] == n]
    return r


def medal(cid, award):
    return [entry_name(e) for e in CON[cid]['entries'] if e.get('award') == award]


def podium_names(cid):
    out = []
    for a in AWARDS:
        out += medal(cid, a)
    assert out, cid
    return out


def top(cid, n):
    return [entry_name(e) for e in placed(cid)[:n]]


def mark(cid, who):
    return fmt(cid, entry(cid, who)['mark'])


def place(cid, who):
    return ordinal(entry(cid, who)['place'])


def lead(cid):
    p = placed(cid)
    return diff(cid, p[0]['mark'], p[1]['mark'])


def margin(cid, who):
    """gap to the next (winner) or to the winner (others)."""
    p = placed(cid)
    e = entry(cid, who)
    other = p[1] if e['place'] == 1 else p[0]
    return diff(cid, e['mark'], other['mark']), entry_name(other)


def contests_of(pid):
    return [c['id'] for c in CONTESTS
            if any(e.get('competitor') == pid or pid in e.get('members', []) for e in c['entries'])]


def shared(a, b):
    return [c for c in contests_of(a) if c in contests_of(b)]


def ahead(cid, a, b):
    ea, eb = entry(cid, a), entry(cid, b)
    assert 'place' in ea and 'place' in eb
    return nm(a) if ea['place'] < eb['place'] else nm(b)


def start(cid):
    return datetime.datetime.fromisoformat(CON[cid]['start'])


def hhmm(cid):
    return start(cid).strftime('%H:%M')


def venue(cid):
    return CON[cid]['venue']


def next_for(pid):
    later = [c for c in contests_of(pid) if CON[c]['status'] == 'scheduled']
    later.sort(key=start)
    return later[0] if later else None


def person_medals(pid, award=None):
    n = collections.Counter()
    for c in contests_of(pid):
        a = entry(c, pid).get('award')
        if a:
            n[a] += 1
    return n[award] if award else sum(n.values())


def table(sport=None, date=None, award=None, category=None):
    t = {g: [0, 0, 0] for g in GROUPS}
    for c in CONTESTS:
        if sport and c['sport'] != sport:
            continue
        if date and start(c['id']).date().isoformat() != date:
            continue
        if category and c['category'] != category:
            continue
        for e in c['entries']:
            a = e.get('award')
            if not a or (award and a != award):
                continue
            g = e.get('group') or grp_of(e['competitor'])
            t[g][AWARDS.index(a)] += 1
    rows = sorted(t.items(), key=lambda kv: (-kv[1][0], -kv[1][1], -kv[1][2], kv[0]))
    return rows


def leaders(**kw):
    rows = table(**kw)
    best = rows[0][1]
    return [gn(g) for g, v in rows if v == best]


def rank(gid, **kw):
    rows = dict(table(**kw))
    mine = rows[gid]
    better = sum(1 for v in rows.values() if v > mine)
    return ordinal(better + 1)


def gmed(gid, award=None, **kw):
    v = dict(table(**kw))[gid]
    return v[AWARDS.index(award)] if award else sum(v)


def most(**kw):
    rows = table(**kw)
    if kw.get('award'):
        key = lambda v: v[AWARDS.index(kw['award'])]
    else:
        key = sum
    best = max(key(v) for _, v in rows)
    return [gn(g) for g, v in rows if key(v) == best], best


def topn(n, **kw):
    rows = table(**kw)
    cut = rows[n - 1][1]
    assert rows[n][1] != cut, 'tie at the cut'
    return [gn(g) for g, _ in rows[:n]], [gn(g) for g, _ in rows[n:]]


def on_day(date, sport=None):
    return sorted([c['id'] for c in CONTESTS if c['start'].startswith(date) and (not sport or c['sport'] == sport)],
                  key=start)


def times_on(date, sport=None):
    return sorted({hhmm(c) for c in on_day(date, sport)})


def live(sport=None):
    return [c['id'] for c in CONTESTS if c['status'] == 'live' and (not sport or c['sport'] == sport)]


def dname(cid):
    c = CON[cid]
    for d in SPORTS[c['sport']]['disciplines']:
        if d['id'] == c['discipline']:
            return d['name']


def best(sport, disc, category=None, rnd=None):
    cands = []
    for c in CONTESTS:
        if c['sport'] != sport or c['discipline'] != disc or c['status'] != 'final':
            continue
        if category and c['category'] != category:
            continue
        if rnd and not c['phase'].startswith(rnd):
            continue
        for e in placed(c['id']):
            cands.append((c['id'], e))
    m = CON[cands[0][0]]['measure']
    keyf = (lambda ce: secs(ce[1]['mark'])) if m == 'time' else (lambda ce: -float(ce[1]['mark']))
    b = min(keyf(ce) for ce in cands)
    win = [ce for ce in cands if keyf(ce) == b]
    return fmt(win[0][0], win[0][1]['mark']), [entry_name(ce[1]) for ce in win]


def sport_of(pid):
    return SPORTS[COMP[pid]['sport']]['name']


def same_given(given):
    return [nm(p) for p, c in COMP.items() if c['given'] == given]


def same_family(fam):
    return [nm(p) for p, c in COMP.items() if c['family'] == fam]


# sanity on moment-dependent facts
assert CON['ath-m-marathon-final']['status'] == 'live'
assert CON['ath-w-100m-final']['status'] == 'scheduled'
assert len(same_given('Zoë')) == 3 and len(same_family('Kovendal')) == 2


# ---------------------------------------------------------------- case builders
def T(ask, intent, slots=None, outcome='answered', focus=None, says=(), never=(), tags=()):
    d = {'ask': ask, 'intent': intent}
    if intent != 'none':
        d['slots'] = dict(slots or {})
    d['outcome'] = outcome
    if focus:
        d['focus'] = focus
    if says:
        d['says'] = list(dict.fromkeys(says))
    if never:
        d['never'] = list(dict.fromkeys(never))
    d['_tags'] = list(tags)
    return d


def NC(ask, focus='other', never=(), tags=(), outcome='not_covered'):
    return T(ask, 'none', outcome=outcome, focus=focus, never=never, tags=['uncovered'] + list(tags))


CASES = []


def single(t):
    tags = t.pop('_tags')
    if tags:
        t['tags'] = list(dict.fromkeys(tags))
    CASES.append(t)


def conv(*turns, tags=()):
    alltags = list(tags)
    for t in turns:
        alltags += t.pop('_tags')
    CASES.append({'conversation': list(turns), 'tags': list(dict.fromkeys(alltags))})


D_TODAY, D_TOM, D_YEST = iso(TODAY), iso(TOMORROW), iso(YESTERDAY)


# ================================================================ single questions
M100, W100 = 'ath-m-100m-final', 'ath-w-100m-final'
M200, W200 = 'ath-m-200m-final', 'ath-w-200m-final'
MAR_M, MAR_W = 'ath-m-marathon-final', 'ath-w-marathon-final'
HJ_M, JAV_M = 'ath-m-high-jump-final', 'ath-m-javelin-final'
AA_W = 'gym-w-all-around-final'

# --- podium
single(T("Who won the men's 100 metres?", 'podium', {'contest': M100}, focus='who',
         says=podium_names(M100), tags=['exact']))
single(T("podium for the womens 1500?", 'podium', {'contest': 'ath-w-1500m-final'}, focus='who',
         says=podium_names('ath-w-1500m-final'), tags=['contraction', 'partial']))
single(T("who took the medals in the women's long jump", 'podium', {'contest': 'ath-w-long-jump-final'},
         focus='who', says=podium_names('ath-w-long-jump-final'), tags=['exact']))
single(T("which team won the men's gold-medal game?", 'podium', {'contest': 'bkb-m-tournament-final'},
         focus='who', says=medal('bkb-m-tournament-final', 'gold'), tags=['alias']))
single(T("who made the podium in the mens road race", 'podium', {'contest': 'cyc-m-road-race-final'},
         focus='who', says=podium_names('cyc-m-road-race-final'), tags=['contraction']))
single(T("which gymnast won the men's all around", 'podium',
         {'contest': 'gym-m-all-around-final'}, focus='who',
         says=medal('gym-m-all-around-final', 'gold'),
         tags=['alias']))
single(T("women's single sculls - who won?", 'podium', {'contest': 'row-w-single-sculls-final'}, focus='who',
         says=podium_names('row-w-single-sculls-final'), tags=['exact']))
single(T("w 200 fly winner pls", 'podium', {'contest': 'swm-w-200m-butterfly-final'}, focus='who',
         says=medal('swm-w-200m-butterfly-final', 'gold'), tags=['partial', 'alias']))
single(T("who won the womens sprint final", 'podium', {'contest': W100}, outcome='no_data', focus='who',
         tags=['alias', 'uncovered']))
single(T("who's the winner of the men's 400 IM?", 'podium', {'contest': 'swm-m-400m-individual-medley-final'},
         outcome='no_data', focus='who', tags=['alias', 'uncovered']))
single(T("who won the men's 10,000 metres", 'podium', {}, outcome='no_data', focus='who',
         never=medal('ath-m-1500m-final', 'gold'), tags=['uncovered', 'unknown_event']))
single(T("who won the double sculls", 'podium', {}, outcome='clarify', focus='who',
         tags=['ambiguous', 'missing_slot', 'clarify']))

# --- medalist
single(T("who got silver in the mens 200 free", 'medalist',
         {'contest': 'swm-m-200m-freestyle-final', 'award': 'silver'}, focus='who',
         says=medal('swm-m-200m-freestyle-final', 'silver'), never=medal('swm-m-200m-freestyle-final', 'gold'),
         tags=['alias', 'contraction']))
single(T("Bronze in the women's marathon went to who?", 'medalist', {'contest': MAR_W, 'award': 'bronze'},
         focus='who', says=medal(MAR_W, 'bronze'), never=medal(MAR_W, 'gold'), tags=['exact']))
single(T("gold medallist women's javelin throw", 'medalist',
         {'contest': 'ath-w-javelin-final', 'award': 'gold'}, focus='who',
         says=medal('ath-w-javelin-final', 'gold'), tags=['terse']))
single(T("who got silver in the women's 200m freestyle?", 'medalist',
         {'contest': 'swm-w-200m-freestyle-final', 'award': 'silver'}, focus='who',
         says=medal('swm-w-200m-freestyle-final', 'silver'), never=medal('swm-w-200m-freestyle-final', 'gold'),
         tags=['exact', 'tie']))
single(T("who grabbed the bronze on men's floor", 'medalist', {'contest': 'gym-m-floor-final', 'award': 'bronze'},
         focus='who', says=medal('gym-m-floor-final', 'bronze'), never=medal('gym-m-floor-final', 'gold'),
         tags=['alias']))
single(T("has anyone got the gold in the men's marathon yet", 'medalist', {'contest': MAR_M, 'award': 'gold'},
         outcome='no_data', focus='who', tags=['uncovered', 'live']))
single(T("who got bronze in the women's 200 free", 'medalist',
         {'contest': 'swm-w-200m-freestyle-final', 'award': 'bronze'}, focus='who',
         never=at_place('swm-w-200m-freestyle-final', 4), tags=['alias', 'tie']))

# --- contest_place
single(T("who came fourth in the men's 100 final", 'contest_place', {'contest': M100, 'place': '4'},
         focus='who', says=at_place(M100, 4), never=medal(M100, 'bronze'), tags=['number_words', 'constraint']))
single(T("5th place women's road race?", 'contest_place', {'contest': 'cyc-w-road-race-final', 'place': '5'},
         focus='who', says=at_place('cyc-w-road-race-final', 5), tags=['constraint']))
single(T("who finished seventh in the mens long jump", 'contest_place',
         {'contest': 'ath-m-long-jump-final', 'place': '7'}, focus='who',
         says=at_place('ath-m-long-jump-final', 7), tags=['number_words', 'contraction']))
single(T("which team ended up 4th in the men's basketball?", 'contest_place',
         {'contest': 'bkb-m-tournament-final', 'place': '4'}, focus='who',
         says=at_place('bkb-m-tournament-final', 4), tags=['constraint']))
single(T("who is running second in the marathon right now", 'contest_place', {'contest': MAR_M, 'place': '2'},
         focus='who', says=at_place(MAR_M, 2), tags=['live', 'number_words']))
single(T("who was 2nd in the men's basketball semi-final", 'contest_place', {'place': '2'}, outcome='no_data',
         focus='who', never=at_place('bkb-m-tournament-final', 2), tags=['uncovered', 'unknown_event']))

# --- full_results
single(T("full results men's 400m", 'full_results', {'contest': 'ath-m-400m-final'}, focus='results',
         says=top('ath-m-400m-final', 8), tags=['terse']))
single(T("can I see the standings in the women's all-around as they are now", 'full_results', {'contest': AA_W},
         focus='results', says=top(AA_W, 3) + [mark(AA_W, 'p230')], tags=['live', 'chatty']))
single(T("top five in the javelin tonight", 'full_results', {'contest': JAV_M, 'count': '5'}, focus='results',
         says=top(JAV_M, 5), never=[entry_name(placed(JAV_M)[5])], tags=['live', 'constraint']))
single(T("results from the men's floor final please", 'full_results', {'contest': 'gym-m-floor-final'},
         focus='results', says=top('gym-m-floor-final', 8), tags=['exact']))
single(T("top 3 mens single sculls", 'full_results', {'contest': 'row-m-single-sculls-final', 'count': '3'},
         focus='results', says=top('row-m-single-sculls-final', 3),
         never=[entry_name(placed('row-m-single-sculls-final')[3])], tags=['constraint', 'contraction']))
single(T("full results of the women's pole vault", 'full_results', {}, outcome='no_data', focus='results',
         never=top('ath-w-long-jump-final', 1), tags=['uncovered', 'unknown_event']))

# --- competitor_result
single(T("how's Iñigo Saltreva getting on?", 'competitor_result', {'competitor': 'p035'},
         focus='how_did', says=[place(MAR_M, 'p035'), mark(MAR_M, 'p035')], tags=['diacritics', 'live']))
single(T("what place did Dorrago get in the 100m final", 'competitor_result', {'competitor': 'p013', 'contest': M100},
         focus='how_did', says=[place(M100, 'p013'), mark(M100, 'p013')],
         never=[mark('ath-m-100m-heat-1', 'p013')], tags=['partial', 'constraint']))
single(T("where did Rhea-Maud O'Carrowin finish in the long jump?", 'competitor_result',
         {'competitor': 'p159', 'contest': 'ath-w-long-jump-final'}, focus='how_did',
         says=[place('ath-w-long-jump-final', 'p159'), mark('ath-w-long-jump-final', 'p159')], tags=['exact']))
single(T("how did drada brorrorn do in the 400", 'competitor_result', {'competitor': 'p139', 'contest': 'ath-w-400m-final'},
         focus='how_did', never=['8th'], tags=['dsq']))
single(T("how did zosard krurvasko go in the 1500 m", 'competitor_result',
         {'competitor': 'p031', 'contest': 'ath-m-1500m-final'}, focus='how_did', never=['9th'], tags=['dns']))
single(T("what time did Tavish Merrow-Kaine do in the road race?", 'competitor_result',
         {'competitor': 'p092', 'contest': 'cyc-m-road-race-final'}, focus='mark', never=['11th'], tags=['dnf']))
single(T("sevora gurrorn javelin mark?", 'competitor_result', {'competitor': 'p182', 'contest': 'ath-w-javelin-final'},
         focus='mark', says=[mark('ath-w-javelin-final', 'p182')], tags=['terse']))
single(T("What did Hanel Zilkedorn score in the all-around?", 'competitor_result',
         {'competitor': 'p114', 'contest': 'gym-m-all-around-final'}, focus='mark',
         says=[mark('gym-m-all-around-final', 'p114')], never=[mark('gym-m-floor-final', 'p114')], tags=['exact']))
single(T("how did hurra brusand get on in the 100 breast", 'competitor_result',
         {'competitor': 'p183', 'contest': 'swm-w-100m-breaststroke-final'}, focus='how_did',
         says=[place('swm-w-100m-breaststroke-final', 'p183'), mark('swm-w-100m-breaststroke-final', 'p183')],
         tags=['misspelling', 'alias']))

# --- competitor_margin
m, who = margin(M100, 'p005')
single(T("by how much did Galkace win the 100 final", 'competitor_margin', {'competitor': 'p005', 'contest': M100},
         focus='margin', says=[m, who], tags=['partial']))
m, who = margin('row-m-single-sculls-final', 'p090')
single(T("how far was Wanard Sindayne off gold in the single sculls?", 'competitor_margin',
         {'competitor': 'p090', 'contest': 'row-m-single-sculls-final'}, focus='margin', says=[m, who],
         tags=['exact']))
m, who = margin('ath-w-long-jump-final', 'p166')
single(T("whats Sondora Hervoveth's winning margin", 'competitor_margin', {'competitor': 'p166'}, focus='margin',
         says=[m, who], tags=['contraction']))
m, who = margin('ath-m-400m-final', 'p020')
single(T("who beat nulan bendand and by how much", 'competitor_margin', {'competitor': 'p020'}, focus='margin',
         says=[m, who], tags=['voice']))
m, who = margin('cyc-w-time-trial-final', 'p210')
single(T("how much did Tetha Brelwick win the time trial by?", 'competitor_margin',
         {'competitor': 'p210', 'contest': 'cyc-w-time-trial-final'}, focus='margin', says=[m, who],
         never=[x for x in at_place('cyc-w-road-race-final', 2) if x not in at_place('cyc-w-time-trial-final', 2)], tags=['alias']))

# --- head_to_head
assert shared('p001', 'p002') == [M100]
single(T("did Dosavorn finish ahead of Zorvren", 'head_to_head', {'competitor': 'p001', 'rival': 'p002'},
         focus='whether', says=[ahead(M100, 'p001', 'p002')], tags=['partial']))
single(T("who did better in the 1500, Hervace or Rindileth?", 'head_to_head',
         {'competitor': 'p141', 'rival': 'p148', 'contest': 'ath-w-1500m-final'}, focus='compare',
         says=[ahead('ath-w-1500m-final', 'p141', 'p148')], tags=['partial']))
single(T("nuvasko v guntasand in the 200 fly, who was quicker", 'head_to_head',
         {'competitor': 'p072', 'rival': 'p083', 'contest': 'swm-m-200m-butterfly-final'}, focus='compare',
         says=[ahead('swm-m-200m-butterfly-final', 'p072', 'p083')], tags=['partial', 'alias', 'constraint']))
single(T("Onov Sarromell or Issov Fustisessi - who came out on top in the breaststroke?", 'head_to_head',
         {'competitor': 'p079', 'rival': 'p082', 'contest': 'swm-m-100m-breaststroke-final'}, focus='compare',
         says=[ahead('swm-m-100m-breaststroke-final', 'p079', 'p082')], tags=['exact', 'constraint']))
single(T("femwick vs dovonasko on floor", 'head_to_head',
         {'competitor': 'p229', 'rival': 'p230', 'contest': 'gym-w-floor-final'}, focus='compare',
         says=[ahead('gym-w-floor-final', 'p229', 'p230')], tags=['partial', 'terse']))

# --- competitor_medals
single(T("how many medals has Zoë Quillon won", 'competitor_medals', {'competitor': 'p196'}, focus='count',
         says=[count(person_medals('p196'))], tags=['diacritics']))
single(T("how many golds for tetha brelwick", 'competitor_medals', {'competitor': 'p210', 'award': 'gold'},
         focus='count', says=[count(person_medals('p210', 'gold'))], tags=['constraint']))
single(T("has Jory won a medal?", 'competitor_medals', {'competitor': 'p069'}, focus='whether',
         says=['silver'], tags=['alias']))
single(T("how many medals does Big Tobi have", 'competitor_medals', {'competitor': 'p253'}, focus='count',
         says=[count(person_medals('p253'))], tags=['alias']))
single(T("how many bronzes has Hothic Nuvasko picked up", 'competitor_medals', {'competitor': 'p072', 'award': 'bronze'},
         focus='count', says=[count(person_medals('p072', 'bronze'))], tags=['constraint']))
single(T("did Mårten Quellby win anything?", 'competitor_medals', {'competitor': 'p104'}, focus='whether',
         never=['gold', 'silver', 'bronze'] if person_medals('p104') == 0 else [], tags=['diacritics']))
single(T("medals merrel vareroy", 'competitor_medals', {'competitor': 'p239'}, focus='count',
         says=[count(person_medals('p239')), 'gold'], tags=['terse', 'team_member']))

# --- competitor_delegation
single(T("which delegation is Anais Cordvelle from", 'competitor_delegation', {'competitor': 'p124'},
         focus='group_of', says=[gn(grp_of('p124'))], tags=['diacritics']))
single(T("what country does rhea maud ocarrowin represent", 'competitor_delegation', {'competitor': 'p159'},
         focus='group_of', says=[gn(grp_of('p159'))], tags=['voice', 'misspelling']))
single(T("who does the Quay Rocket run for?", 'competitor_delegation', {'competitor': 'p005'}, focus='group_of',
         says=[gn(grp_of('p005'))], tags=['alias']))
single(T("Søvi Arkenlund - team?", 'competitor_delegation', {'competitor': 'p243'}, focus='group_of',
         says=[gn(grp_of('p243'))], tags=['diacritics', 'terse']))
single(T("is Lomov Kerreth from Pellavia", 'competitor_delegation', {'competitor': 'p053'}, focus='whether',
         says=[gn(grp_of('p053'))], tags=['exact']))

# --- competitor_sport
single(T("what sport is Tobiah Dunmark in?", 'competitor_sport', {'competitor': 'p253'}, focus='sport_of',
         says=[sport_of('p253')], tags=['diacritics']))
single(T("what does Renée Ostravin compete in", 'competitor_sport', {'competitor': 'p207'}, focus='sport_of',
         says=[sport_of('p207')] + [dname(c) for c in contests_of('p207')], tags=['diacritics']))
single(T("which events is Halmvik swimming at these games", 'competitor_sport', {'competitor': 'p069'},
         focus='sport_of', says=[dname(c) for c in contests_of('p069')], tags=['partial']))
single(T("whats kovendals sport", 'competitor_sport', {}, outcome='clarify', focus='sport_of',
         says=same_family('Kovendal'), tags=['ambiguous', 'clarify', 'partial']))

# --- competitor_next
nx = next_for('p196')
single(T("when does Zoe Quillon swim next", 'competitor_next', {'competitor': 'p196'}, focus='when',
         says=[hhmm(nx), venue(nx)], tags=['diacritics']))
nx = next_for('p100')
single(T("next event for Tentovar?", 'competitor_next', {'competitor': 'p100'}, focus='when',
         says=[hhmm(nx), venue(nx)], tags=['partial']))
nx = next_for('p129')
single(T("when is gerira gumarace on again", 'competitor_next', {'competitor': 'p129'}, focus='when',
         says=[hhmm(nx)], tags=['voice']))
assert next_for('p005') is None
single(T("is the quay rocket running again at these games", 'competitor_next', {'competitor': 'p005'},
         outcome='no_data', focus='when', tags=['alias', 'uncovered']))

# --- competitor_profile
single(T("tell me about Hothic Nuvasko", 'competitor_profile', {'competitor': 'p072'}, focus='profile',
         says=['gold', 'bronze', mark('swm-m-200m-butterfly-final', 'p072')], tags=['exact']))
single(T("how have the games gone for Tetha Brelwick so far", 'competitor_profile', {'competitor': 'p210'},
         focus='profile', says=['gold', mark('cyc-w-road-race-final', 'p210'), mark('cyc-w-time-trial-final', 'p210')],
         tags=['chatty']))
single(T("Bana Gulelick so far?", 'competitor_profile', {'competitor': 'p131'}, focus='profile',
         says=[mark(W200, 'p131'), 'gold'], tags=['terse']))

# --- contest_time
single(T("when's the women's 100m final", 'contest_time', {'contest': W100}, focus='when',
         says=[hhmm(W100)], tags=['contraction']))
single(T("what time does the men's vault start", 'contest_time', {'contest': 'gym-m-vault-final'}, focus='when',
         says=[hhmm('gym-m-vault-final')], never=[hhmm('gym-w-vault-final')] if hhmm('gym-w-vault-final') != hhmm('gym-m-vault-final') else [],
         tags=['exact']))
single(T("where is the women's double sculls being held?", 'contest_time', {'contest': 'row-w-double-sculls-final'},
         focus='where', says=[venue('row-w-double-sculls-final')], tags=['exact']))
single(T("what time was the men's 100 final last night", 'contest_time', {'contest': M100}, focus='when',
         says=[hhmm(M100)], never=[hhmm('ath-m-100m-heat-1')], tags=['relative_day']))
single(T("where's the marathon route tonight", 'contest_time', {'contest': MAR_M}, focus='where',
         says=[venue(MAR_M)], tags=['relative_day']))
single(T("when is the triathlon", 'contest_time', {}, outcome='no_data', focus='when',
         tags=['uncovered', 'unknown_event']))
single(T("where did the men's road race take place", 'contest_time', {'contest': 'cyc-m-road-race-final'},
         outcome='no_data', focus='where', never=[venue('cyc-w-time-trial-final')],
         tags=['uncovered', 'no_venue']))

# --- delegation_in_event
e = entry(M100, 'p001')
single(T("how did Kalvenmark do in the men's 100 final", 'delegation_in_event', {'group': 'kalvenmark', 'contest': M100},
         focus='how_did', says=[nm('p001'), 'silver', mark(M100, 'p001')], tags=['exact']))
single(T("how'd the Orrindel Islanders get on in the men's basketball", 'delegation_in_event',
         {'group': 'orrindel', 'contest': 'bkb-m-tournament-final'}, focus='how_did',
         says=['bronze', place('bkb-m-tournament-final', 'orrindel')], tags=['alias', 'contraction']))
single(T("Estravane in the women's 1500?", 'delegation_in_event', {'group': 'estravane', 'contest': 'ath-w-1500m-final'},
         focus='how_did', says=[nm('p147'), place('ath-w-1500m-final', 'p147')], tags=['terse']))
single(T("how are halvorne doing in the javelin tonight", 'delegation_in_event', {'group': 'halvorne', 'contest': JAV_M},
         focus='how_did', says=[nm('p067'), place(JAV_M, 'p067')], tags=['live', 'relative_day']))
single(T("welkmarsh double sculls result", 'delegation_in_event',
         {'group': 'welkmarsh', 'contest': 'row-m-double-sculls-final'}, focus='how_did',
         says=[place('row-m-double-sculls-final', 'welkmarsh'), mark('row-m-double-sculls-final', 'welkmarsh')],
         tags=['terse']))

# --- delegation_medals
single(T("how many medals has Quessary got", 'delegation_medals', {'group': 'quessary'}, focus='count',
         says=[count(gmed('quessary'))] + [count(gmed('quessary', a)) for a in AWARDS], tags=['exact']))
single(T("vastrelia medal count and where they rank", 'delegation_medals', {'group': 'vastrelia'}, focus='count',
         says=[count(gmed('vastrelia')), rank('vastrelia')], tags=['terse']))
single(T("how many golds has Kalvenmark won", 'delegation_medals', {'group': 'kalvenmark', 'award': 'gold'},
         focus='count', says=[count(gmed('kalvenmark', 'gold'))], tags=['constraint']))
single(T("how many swimming medals for Halvorne?", 'delegation_medals', {'group': 'halvorne', 'sport': 'swimming'},
         focus='count', says=[count(gmed('halvorne', sport='swimming'))], never=[count(gmed('halvorne'))],
         tags=['constraint']))
single(T("what did the orrindel team win yesterday", 'delegation_medals', {'group': 'orrindel', 'date': D_YEST},
         focus='count', says=[count(gmed('orrindel', date=D_YEST))], never=[count(gmed('orrindel'))],
         tags=['relative_day', 'constraint']))
single(T("where does Brellmoor sit in the medal table?", 'delegation_medals', {'group': 'brellmoor'}, focus='rank',
         says=[rank('brellmoor')], tags=['exact']))
single(T("how many cycling medals does dunmerrow have", 'delegation_medals', {'group': 'dunmerrow', 'sport': 'cycling'},
         focus='count', says=[count(gmed('dunmerrow', sport='cycling'))], never=[count(gmed('dunmerrow'))],
         tags=['constraint']))
single(T("has Welkmarsh won any medals", 'delegation_medals', {'group': 'welkmarsh'}, focus='whether',
         tags=['exact']))

# --- medal table
single(T("who's top of the medal table", 'medal_table_leader', {}, focus='who', says=leaders(),
         tags=['contraction']))
single(T("who leads the swimming medals?", 'medal_table_leader', {'sport': 'swimming'}, focus='who',
         says=leaders(sport='swimming'), never=[x for x in leaders() if x not in leaders(sport='swimming')],
         tags=['constraint']))
tue = iso(weekday('tuesday', past=True))
single(T("who topped the medals on Tuesday", 'medal_table_leader', {'date': tue}, focus='who',
         says=leaders(date=tue), tags=['relative_day', 'constraint']))
single(T("who's leading in gymnastics medals", 'medal_table_leader', {'sport': 'gymnastics'}, focus='who',
         says=leaders(sport='gymnastics'), tags=['constraint', 'tie']))
t5, rest5 = topn(5)
single(T("top 5 in the medal standings", 'medal_table_top', {'count': '5'}, focus='table', says=t5,
         never=rest5[:1], tags=['constraint']))
single(T("show me the medal table", 'medal_table_top', {}, focus='table', says=topn(3)[0], tags=['exact']))
t2, r2 = topn(2, sport='rowing')
single(T("top two in rowing medals", 'medal_table_top', {'sport': 'rowing', 'count': '2'}, focus='table',
         says=t2, never=r2[:1], tags=['constraint', 'number_words']))
single(T("which delegation has the most medals overall", 'most_medals', {}, focus='who', says=most()[0],
         tags=['tie']))
single(T("who has won the most swimming medals", 'most_medals', {'sport': 'swimming'}, focus='who',
         says=most(sport='swimming')[0], tags=['constraint', 'tie']))
single(T("most bronze medals?", 'most_medals', {'award': 'bronze'}, focus='who', says=most(award='bronze')[0],
         tags=['constraint', 'terse']))

# --- schedule_day / under_way / live_leader / best_mark
single(T("what's on tomorrow", 'schedule_day', {'date': D_TOM}, focus='schedule', says=times_on(D_TOM),
         tags=['relative_day']))
mon = iso(weekday('monday', past=False))
single(T("anything in gymnastics on monday?", 'schedule_day', {'date': mon, 'sport': 'gymnastics'},
         focus='schedule', says=times_on(mon, 'gymnastics'),
         never=[t for t in times_on(mon) if t not in times_on(mon, 'gymnastics')], tags=['relative_day', 'constraint']))
single(T("track and field programme for today", 'schedule_day', {'date': D_TODAY, 'sport': 'athletics'},
         focus='schedule', says=times_on(D_TODAY, 'athletics'),
         never=[t for t in times_on(D_TODAY) if t not in times_on(D_TODAY, 'athletics')],
         tags=['alias', 'relative_day', 'constraint']))
single(T("schedule for the 17th", 'schedule_day', {'date': '2027-08-17'}, focus='schedule',
         says=times_on('2027-08-17'), tags=['constraint']))
single(T("what was on yesterday", 'schedule_day', {'date': D_YEST}, focus='schedule', says=times_on(D_YEST),
         tags=['relative_day']))
single(T("what's happening right now", 'under_way', {}, focus='schedule', says=[dname(c) for c in live()],
         tags=['exact']))
single(T("anything live in athletics at the moment", 'under_way', {'sport': 'athletics'}, focus='schedule',
         says=[dname(c) for c in live('athletics')], never=[dname(c) for c in live('gymnastics')],
         tags=['constraint']))
single(T("is there any swimming going on now", 'under_way', {'sport': 'swimming'}, focus='status',
         tags=['constraint']))
single(T("who's leading the marathon", 'live_leader', {'contest': MAR_M}, focus='who', says=at_place(MAR_M, 1),
         never=medal(MAR_W, 'gold'), tags=['live']))
single(T("high jump leader right now and by how much", 'live_leader', {'contest': HJ_M}, focus='who',
         says=at_place(HJ_M, 1) + [lead(HJ_M)], tags=['live']))
v, ws = best('athletics', '100m', 'women')
single(T("fastest women's 100 so far?", 'best_mark', {'discipline': 'athletics/100m', 'category': 'women'},
         focus='mark', says=[v] + ws, tags=['tie']))
v, ws = best('athletics', '100m', 'men', 'heat')
single(T("quickest time in the men's 100m heats", 'best_mark',
         {'discipline': 'athletics/100m', 'category': 'men', 'round': 'heat'}, focus='mark', says=[v] + ws,
         never=[best('athletics', '100m', 'men')[0]], tags=['constraint']))
v, ws = best('athletics', 'long-jump')
single(T("longest long jump of the games", 'best_mark', {'discipline': 'athletics/long-jump'}, focus='mark',
         says=[v] + ws, tags=['exact']))
v, ws = best('athletics', '1500m', 'men')
single(T("best mens 1500 time so far", 'best_mark', {'discipline': 'athletics/1500m', 'category': 'men'},
         focus='mark', says=[v] + ws, never=[best('athletics', '1500m', 'women')[0]], tags=['contraction']))
single(T("best time in the women's 400 IM", 'best_mark',
         {'discipline': 'swimming/400m-individual-medley', 'category': 'women'}, outcome='no_data', focus='mark',
         tags=['uncovered']))

# --- chat
single(T("hello!", 'greeting', {}, focus='chat', tags=['chat']))
single(T("what kind of stuff can I ask you?", 'help', {}, focus='chat', tags=['chat']))
single(T("cheers mate", 'thanks', {}, focus='chat', tags=['chat']))

# --- uncovered singles
single(NC("how old is Zoë Quillon?", tags=['diacritics']))
single(NC("what's the weather going to be like for the women's high jump"))
single(NC("which tv channel is showing the javelin"))
single(NC("where can i get tickets for the women's basketball final"))
single(NC("who's favourite for the women's 100 tomorrow", focus='who', never=[], tags=['prediction']))
single(NC("what's the world record in the men's 100m", focus='mark'))
single(NC("what was morressi's split at halfway", focus='mark', tags=['live']))
single(NC("who was Dunmerrow's top scorer in the basketball final", focus='who',
          never=[nm(p) for p in entry('bkb-m-tournament-final', 'dunmerrow')['members']]))
single(NC("what was the wind reading for the men's 100 final", focus='other'))
single(NC("which athlete has won the most medals at the games", focus='who'))
single(NC("how many athletes are taking part in total", focus='count'))
qw = gmed('quessary', category='women')
single(NC("how many medals have Quessary's women won", focus='count', never=[count(gmed('quessary'))],
          tags=['constraint']))
assert leaders(category='men') != leaders()
single(NC("who leads the medal table if you only count men's events", focus='who', never=leaders(),
          tags=['constraint']))
single(NC("when's the closing ceremony", focus='when'))
single(NC("how tall is Big Tobi", tags=['alias']))
single(NC("who coaches Thorust Fuswick"))
single(NC("what lane is Anaïs Cordvelle in for the final", tags=['diacritics']))
single(NC("how many people were in the stadium for the sprint final", focus='count'))
single(NC("which delegation has the fewest medals", focus='who'))
single(NC("can you remind me when the 400 IM starts", tags=['request']))
single(NC("whats the prize money for a gold", focus='other'))
single(NC("tell me a joke", outcome='not_understood', focus='other'))
single(NC("asdf jkl;", outcome='not_understood', focus='other', tags=['gibberish']))


# ================================================================ conversations
FLOOR_W = 'gym-w-floor-final'
# 1 parent, gymnastics
conv(T("my daughter is mad about gymnastics - who won the women's floor?", 'podium', {'contest': FLOOR_W},
       focus='who', says=podium_names(FLOOR_W), tags=['chatty']),
     T("and the girl who got bronze, how is she doing in the all-around tonight", 'competitor_result',
       {'competitor': 'p230', 'contest': AA_W}, focus='how_did', says=[place(AA_W, 'p230'), mark(AA_W, 'p230')],
       tags=['follow_up', 'live']),
     T("which country is she from?", 'competitor_delegation', {'competitor': 'p230'}, focus='group_of',
       says=[gn(grp_of('p230'))], tags=['pronoun']),
     T("thank you so much", 'thanks', {}, focus='chat', tags=['thanks_between']),
     T("oh and when is the women's vault final, she wants to watch it", 'contest_time',
       {'contest': 'gym-w-vault-final'}, focus='when', says=[hhmm('gym-w-vault-final'), venue('gym-w-vault-final')],
       tags=['new_question', 'chatty']),
     tags=['parent'])
# 2 fantasy player medals
conv(T("how many medals has Hothic Nuvasko got", 'competitor_medals', {'competitor': 'p072'}, focus='count',
       says=[count(person_medals('p072'))]),
     T("how many of those are gold", 'competitor_medals', {'competitor': 'p072', 'award': 'gold'}, focus='count',
       says=[count(person_medals('p072', 'gold'))], tags=['follow_up', 'constraint']),
     T("what about Jory, total medals?", 'competitor_medals', {'competitor': 'p069'}, focus='count',
       says=[count(person_medals('p069'))], tags=['alias', 'follow_up']),
     T("of those two, who was ahead in the 100 free", 'head_to_head',
       {'competitor': 'p072', 'rival': 'p069', 'contest': 'swm-m-100m-freestyle-final'}, focus='compare',
       says=[ahead('swm-m-100m-freestyle-final', 'p072', 'p069')], tags=['pronoun', 'constraint']),
     tags=['fantasy'])
# 3 commuter voice 1500
m, who = margin('ath-m-1500m-final', 'p030')
conv(T("who won the men's fifteen hundred", 'podium', {'contest': 'ath-m-1500m-final'}, focus='who',
       says=medal('ath-m-1500m-final', 'gold'), tags=['voice', 'number_words']),
     T("what was his time", 'competitor_result', {'competitor': 'p030', 'contest': 'ath-m-1500m-final'},
       focus='mark', says=[mark('ath-m-1500m-final', 'p030')], tags=['voice', 'pronoun']),
     T("and how much did he win it by", 'competitor_margin', {'competitor': 'p030', 'contest': 'ath-m-1500m-final'},
       focus='margin', says=[m, who], tags=['voice', 'pronoun']),
     tags=['commuter'])
# 4 intern live leaders, ellipsis
conv(T("javelin ldr?", 'live_leader', {'contest': JAV_M}, focus='who', says=at_place(JAV_M, 1) + [lead(JAV_M)],
       tags=['misspelling', 'terse', 'live']),
     T("hj?", 'live_leader', {'contest': HJ_M}, focus='who', says=at_place(HJ_M, 1), tags=['ellipsis', 'terse']),
     T("mthon", 'live_leader', {'contest': MAR_M}, focus='who', says=at_place(MAR_M, 1),
       tags=['ellipsis', 'misspelling']),
     T("gap to 2nd in mthon?", 'live_leader', {'contest': MAR_M}, focus='margin', says=at_place(MAR_M, 2),
       tags=['follow_up']),
     tags=['intern'])
# 5 Dunmerrow fan
conv(T("how many medals has Dunmerrow got", 'delegation_medals', {'group': 'dunmerrow'}, focus='count',
       says=[count(gmed('dunmerrow')), rank('dunmerrow')]),
     T("any of them today?", 'delegation_medals', {'group': 'dunmerrow', 'date': D_TODAY}, focus='count',
       says=[count(gmed('dunmerrow', date=D_TODAY))], tags=['relative_day', 'follow_up', 'pronoun']),
     T("how did they do in the men's basketball final", 'delegation_in_event',
       {'group': 'dunmerrow', 'contest': 'bkb-m-tournament-final'}, focus='how_did',
       says=['gold', mark('bkb-m-tournament-final', 'dunmerrow')], tags=['pronoun']),
     T("when do the women play theirs", 'contest_time', {'contest': 'bkb-w-tournament-final'}, focus='when',
       says=[hhmm('bkb-w-tournament-final'), venue('bkb-w-tournament-final')], tags=['ellipsis', 'pronoun']),
     T("and how many rowing medals for dunmerrow", 'delegation_medals', {'group': 'dunmerrow', 'sport': 'rowing'},
       focus='count', says=[count(gmed('dunmerrow', sport='rowing'))], never=[count(gmed('dunmerrow'))],
       tags=['constraint']),
     tags=['delegation_fan'])
# 6 comparing Galkace / Dorrago
m, who = margin(M200, 'p005')
conv(T("who finished ahead in the 200 m, Galkace or Dorrago?", 'head_to_head',
       {'competitor': 'p005', 'rival': 'p013', 'contest': M200}, focus='compare', says=[ahead(M200, 'p005', 'p013')],
       tags=['partial', 'constraint']),
     T("and in their 100 heat?", 'head_to_head', {'competitor': 'p005', 'rival': 'p013', 'contest': 'ath-m-100m-heat-1'},
       focus='compare', says=[ahead('ath-m-100m-heat-1', 'p005', 'p013')],
       tags=['ellipsis', 'constraint', 'follow_up']),
     T("by how much did Galkace win the 200", 'competitor_margin', {'competitor': 'p005', 'contest': M200},
       focus='margin', says=[m, who]),
     tags=['compare'])
# 7 programme
conv(T("what's on tomorrow?", 'schedule_day', {'date': D_TOM}, focus='schedule', says=times_on(D_TOM),
       tags=['relative_day']),
     T("anything in the pool?", 'schedule_day', {'date': D_TOM, 'sport': 'swimming'}, focus='schedule',
       says=times_on(D_TOM, 'swimming'), never=[t for t in times_on(D_TOM) if t not in times_on(D_TOM, 'swimming')],
       tags=['ellipsis', 'constraint']),
     T("who's in that race", 'none', outcome='not_covered', focus='other', tags=['uncovered', 'pronoun', 'start_list']),
     T("ok and monday, all sports", 'schedule_day', {'date': mon}, focus='schedule', says=times_on(mon),
       tags=['ellipsis', 'relative_day']),
     tags=['programme'])
# 8 what is left
conv(T("what's left to be decided at these games", 'none', outcome='not_covered', focus='open',
       tags=['uncovered']),
     T("ok then, what's going on right now", 'under_way', {}, focus='schedule', says=[dname(c) for c in live()],
       tags=['new_question']),
     T("who's ahead in the all-around", 'live_leader', {'contest': AA_W}, focus='who', says=at_place(AA_W, 1),
       tags=['live']),
     tags=['what_left'])
# 9 Zoë clarify
conv(T("how did Zoë do?", 'competitor_profile', {}, outcome='clarify', focus='how_did', says=same_given('Zoë'),
       tags=['ambiguous', 'clarify', 'partial', 'diacritics']),
     T("the swimmer", 'competitor_profile', {'competitor': 'p196'}, focus='how_did',
       says=['silver', 'bronze', mark('swm-w-100m-freestyle-final', 'p196')], tags=['ellipsis']),
     T("when's her next race", 'competitor_next', {'competitor': 'p196'}, focus='when',
       says=[hhmm(next_for('p196'))], tags=['pronoun']),
     tags=['clarify'])
# 10 Zoë rower
conv(T("what does zoe do", 'competitor_sport', {}, outcome='clarify', focus='sport_of', says=same_given('Zoë'),
       tags=['ambiguous', 'clarify', 'voice']),
     T("the one from sordavia", 'competitor_sport', {'competitor': 'p199'}, focus='sport_of',
       says=[sport_of('p199')], tags=['ellipsis']),
     T("how did she do", 'competitor_result', {'competitor': 'p199'},
       focus='how_did', says=[place('row-w-single-sculls-final', 'p199'), mark('row-w-single-sculls-final', 'p199')],
       tags=['pronoun']),
     T("who won that race then", 'podium', {'contest': 'row-w-single-sculls-final'}, focus='who',
       says=medal('row-w-single-sculls-final', 'gold'), tags=['pronoun']),
     tags=['clarify'])
# 11 100m ambiguity
conv(T("who won the 100 metres", 'podium', {}, outcome='clarify', focus='who',
       tags=['ambiguous', 'missing_slot', 'clarify']),
     T("the men's", 'podium', {'contest': M100}, focus='who', says=medal(M100, 'gold'), tags=['ellipsis']),
     T("and silver?", 'medalist', {'contest': M100, 'award': 'silver'}, focus='who', says=medal(M100, 'silver'),
       never=medal(M100, 'gold'), tags=['ellipsis']),
     T("when's the women's final then", 'contest_time', {'contest': W100}, focus='when', says=[hhmm(W100)],
       tags=['follow_up']),
     tags=['clarify'])
# 12 road race clarify
conv(T("road race winner?", 'podium', {}, outcome='clarify', focus='who', tags=['ambiguous', 'clarify', 'terse']),
     T("women", 'podium', {'contest': 'cyc-w-road-race-final'}, focus='who',
       says=medal('cyc-w-road-race-final', 'gold'), never=medal('cyc-m-road-race-final', 'gold'), tags=['ellipsis']),
     T("did she win the TT as well", 'competitor_result', {'competitor': 'p210', 'contest': 'cyc-w-time-trial-final'},
       focus='whether', says=[mark('cyc-w-time-trial-final', 'p210')], tags=['pronoun', 'alias']),
     tags=['clarify'])
# 13 Kovendal
conv(T("how did Kovendal do", 'competitor_profile', {}, outcome='clarify', focus='how_did',
       says=same_family('Kovendal'), tags=['ambiguous', 'clarify', 'partial']),
     T("the swimmer, stemelle", 'competitor_profile', {'competitor': 'p184'}, focus='how_did',
       says=['gold', mark('swm-w-100m-breaststroke-final', 'p184')], tags=['ellipsis']),
     T("by how much did she win the breaststroke", 'competitor_margin',
       {'competitor': 'p184', 'contest': 'swm-w-100m-breaststroke-final'}, focus='margin',
       says=list(margin('swm-w-100m-breaststroke-final', 'p184')), tags=['pronoun']),
     tags=['clarify'])
# 14 voice commuter marathon
conv(T("whos in front in the marathon", 'live_leader', {'contest': MAR_M}, focus='who', says=at_place(MAR_M, 1),
       tags=['voice']),
     T("where is iniyo saltreva", 'competitor_result', {'competitor': 'p035', 'contest': MAR_M}, focus='how_did',
       says=[place(MAR_M, 'p035')], tags=['voice', 'mishearing']),
     T("which country does he run for", 'competitor_delegation', {'competitor': 'p035'}, focus='group_of',
       says=[gn(grp_of('p035'))], tags=['pronoun', 'voice']),
     T("what's the temperature out on the course", 'none', outcome='not_covered', focus='other',
       tags=['uncovered', 'voice']),
     tags=['commuter'])
# 15 Quessary fan across sports
conv(T("how are Quessary doing in the medal table", 'delegation_medals', {'group': 'quessary'}, focus='rank',
       says=[rank('quessary'), count(gmed('quessary'))]),
     T("how many in swimming?", 'delegation_medals', {'group': 'quessary', 'sport': 'swimming'}, focus='count',
       says=[count(gmed('quessary', sport='swimming'))], never=[count(gmed('quessary'))],
       tags=['ellipsis', 'constraint']),
     T("and athletics", 'delegation_medals', {'group': 'quessary', 'sport': 'athletics'}, focus='count',
       says=[count(gmed('quessary', sport='athletics'))], tags=['ellipsis', 'constraint']),
     T("how did they get on in the women's javelin", 'delegation_in_event',
       {'group': 'quessary', 'contest': 'ath-w-javelin-final'}, focus='how_did',
       says=[nm('p175'), 'gold'], tags=['pronoun']),
     T("and in the men's 100 breaststroke", 'delegation_in_event',
       {'group': 'quessary', 'contest': 'swm-m-100m-breaststroke-final'}, focus='how_did',
       says=[nm('p069'), place('swm-m-100m-breaststroke-final', 'p069')], tags=['ellipsis']),
     T("who is Quessary's best hope tomorrow", 'none', outcome='not_covered', focus='other',
       tags=['uncovered', 'prediction']),
     tags=['delegation_fan'])
# 16 parent basketball
conv(T("my son plays basketball, did Zandrel win the men's final?", 'delegation_in_event',
       {'group': 'zandrel', 'contest': 'bkb-m-tournament-final'}, focus='whether',
       says=['silver', place('bkb-m-tournament-final', 'zandrel')], tags=['chatty']),
     T("who beat them", 'podium', {'contest': 'bkb-m-tournament-final'}, focus='who',
       says=medal('bkb-m-tournament-final', 'gold'), tags=['pronoun']),
     T("what was the score", 'full_results', {'contest': 'bkb-m-tournament-final'}, focus='mark',
       says=[mark('bkb-m-tournament-final', 'dunmerrow'), mark('bkb-m-tournament-final', 'zandrel')],
       tags=['follow_up']),
     T("is big tobi on that team", 'competitor_delegation', {'competitor': 'p253'}, focus='group_of',
       says=[gn(grp_of('p253'))], tags=['alias']),
     T("how many points did he score", 'none', outcome='not_covered', focus='mark', tags=['uncovered', 'pronoun']),
     tags=['parent'])
# 17 intern typos medal table
conv(T("medl table top 3", 'medal_table_top', {'count': '3'}, focus='table', says=topn(3)[0],
       never=topn(3)[1][:1], tags=['misspelling', 'terse']),
     T("swimming only", 'medal_table_top', {'count': '3', 'sport': 'swimming'}, focus='table',
       says=topn(3, sport='swimming')[0], never=topn(3, sport='swimming')[1][:1],
       tags=['ellipsis', 'constraint']),
     T("gymnastics leader", 'medal_table_leader', {'sport': 'gymnastics'}, focus='who',
       says=leaders(sport='gymnastics'), tags=['ellipsis', 'constraint']),
     tags=['intern'])
# 18 voice medal table yesterday
conv(T("who won the most medals yesterday", 'most_medals', {'date': D_YEST}, focus='who',
       says=most(date=D_YEST)[0], tags=['voice', 'relative_day']),
     T("and who topped the table yesterday", 'medal_table_leader', {'date': D_YEST}, focus='who',
       says=leaders(date=D_YEST), tags=['voice', 'relative_day']),
     T("how many did kalven mark win yesterday", 'delegation_medals', {'group': 'kalvenmark', 'date': D_YEST},
       focus='count', says=[count(gmed('kalvenmark', date=D_YEST))], tags=['voice', 'mishearing']),
     tags=['commuter'])
# 19 two sprinters compare women
conv(T("Gulelick or Missorn, who was faster in the 200?", 'head_to_head',
       {'competitor': 'p131', 'rival': 'p130', 'contest': W200}, focus='compare', says=[ahead(W200, 'p131', 'p130')],
       tags=['partial', 'constraint']),
     T("by how much", 'competitor_margin', {'competitor': 'p131', 'contest': W200}, focus='margin',
       says=[margin(W200, 'p131')[0]], tags=['ellipsis']),
     T("are they both in the 100 final tomorrow", 'none', outcome='not_covered', focus='whether',
       tags=['uncovered', 'pronoun', 'start_list']),
     T("what time does that final start", 'contest_time', {'contest': W100}, focus='when', says=[hhmm(W100)],
       tags=['pronoun']),
     tags=['compare'])
# 20 sprint heats
conv(T("who won the first heat of the women's 100", 'contest_place', {'contest': 'ath-w-100m-heat-1', 'place': '1'},
       focus='who', says=at_place('ath-w-100m-heat-1', 1), never=at_place('ath-w-100m-heat-2', 1),
       tags=['constraint', 'number_words']),
     T("and heat two", 'contest_place', {'contest': 'ath-w-100m-heat-2', 'place': '1'}, focus='who',
       says=at_place('ath-w-100m-heat-2', 1), tags=['ellipsis', 'number_words']),
     T("what time did she run", 'competitor_result', {'competitor': 'p129', 'contest': 'ath-w-100m-heat-2'},
       focus='mark', says=[mark('ath-w-100m-heat-2', 'p129')], tags=['pronoun']),
     T("was that faster than the heat one winner", 'none', outcome='not_covered', focus='compare',
       tags=['uncovered']),
     tags=['heats'])
# 21 swimming fan
conv(T("who won the men's 100 free", 'podium', {'contest': 'swm-m-100m-freestyle-final'}, focus='who',
       says=medal('swm-m-100m-freestyle-final', 'gold'), tags=['alias']),
     T("what was his time", 'competitor_result', {'competitor': 'p083', 'contest': 'swm-m-100m-freestyle-final'},
       focus='mark', says=[mark('swm-m-100m-freestyle-final', 'p083')], tags=['pronoun']),
     T("is that a games record", 'none', outcome='not_covered', focus='other', tags=['uncovered']),
     T("ok, who came fourth", 'contest_place', {'contest': 'swm-m-100m-freestyle-final', 'place': '4'}, focus='who',
       says=at_place('swm-m-100m-freestyle-final', 4), tags=['ellipsis', 'number_words']),
     tags=['swim_fan'])
# 22 gymnastics live follow
conv(T("how's the women's all around going", 'live_leader', {'contest': AA_W}, focus='who',
       says=at_place(AA_W, 1), tags=['live']),
     T("who's third", 'contest_place', {'contest': AA_W, 'place': '3'}, focus='who', says=at_place(AA_W, 3),
       tags=['ellipsis', 'number_words']),
     T("what's Femwick's score", 'competitor_result', {'competitor': 'p229', 'contest': AA_W}, focus='mark',
       says=[mark(AA_W, 'p229')], never=[mark(FLOOR_W, 'p229')], tags=['partial']),
     T("when does it finish", 'none', outcome='not_covered', focus='when', tags=['uncovered']),
     tags=['live'])
# 23 thanks in middle, cycling
nx = next_for('p101')
conv(T("hi, who won the men's road race?", 'podium', {'contest': 'cyc-m-road-race-final'}, focus='who',
       says=medal('cyc-m-road-race-final', 'gold'), tags=['chatty']),
     T("thanks!", 'thanks', {}, focus='chat', tags=['thanks_between']),
     T("is he riding the time trial", 'competitor_next', {'competitor': 'p101'}, focus='when',
       says=[hhmm(nx)], tags=['pronoun']),
     T("where's that", 'contest_time', {'contest': 'cyc-m-time-trial-final'}, focus='where',
       says=[venue('cyc-m-time-trial-final')], tags=['pronoun']),
     tags=['thanks_between'])
# 24 rowing
conv(T("men's double sculls result", 'full_results', {'contest': 'row-m-double-sculls-final'}, focus='results',
       says=top('row-m-double-sculls-final', 6), tags=['terse']),
     T("how did the Corvanthe crew do", 'delegation_in_event', {'group': 'corvanthe', 'contest': 'row-m-double-sculls-final'},
       focus='how_did', says=[place('row-m-double-sculls-final', 'corvanthe'), 'bronze'], tags=['follow_up', 'alias']),
     T("when do the women race theirs", 'contest_time', {'contest': 'row-w-double-sculls-final'}, focus='when',
       says=[hhmm('row-w-double-sculls-final')], tags=['ellipsis', 'pronoun']),
     tags=['rowing'])
# 25 voice mishearing galkace
conv(T("how many golds has wonorin gal case won", 'competitor_medals', {'competitor': 'p005', 'award': 'gold'},
       focus='count', says=[count(person_medals('p005', 'gold'))], tags=['voice', 'mishearing']),
     T("which events", 'competitor_profile', {'competitor': 'p005'}, focus='profile',
       says=[dname(M100), dname(M200)], tags=['ellipsis', 'voice']),
     T("whats his personal best in the two hundred", 'none', outcome='not_covered', focus='mark',
       tags=['uncovered', 'voice', 'number_words']),
     tags=['commuter'])
# 26 javelin women's vs men's
v, ws = best('athletics', 'javelin', 'women')
conv(T("best women's javelin throw so far", 'best_mark', {'discipline': 'athletics/javelin', 'category': 'women'},
       focus='mark', says=[v] + ws),
     T("and who's leading the men's now", 'live_leader', {'contest': JAV_M}, focus='who',
       says=at_place(JAV_M, 1) + [mark(JAV_M, 'p067')], tags=['ellipsis', 'live']),
     T("what delegation is he", 'competitor_delegation', {'competitor': 'p067'}, focus='group_of',
       says=[gn(grp_of('p067'))], tags=['pronoun']),
     tags=['compare_events'])
# 27 help then questions
conv(T("hey there", 'greeting', {}, focus='chat', tags=['chat']),
     T("what can you do", 'help', {}, focus='chat', tags=['chat']),
     T("ok - who won the women's 400 m", 'podium', {'contest': 'ath-w-400m-final'}, focus='who',
       says=medal('ath-w-400m-final', 'gold'), never=[nm('p139')], tags=['new_question']),
     T("was someone disqualified", 'none', outcome='not_covered', focus='other', tags=['uncovered']),
     tags=['chat'])
# 28 high jump
conv(T("who's leading the men's high jump", 'live_leader', {'contest': HJ_M}, focus='who', says=at_place(HJ_M, 1)),
     T("what height has he cleared", 'competitor_result', {'competitor': 'p053', 'contest': HJ_M}, focus='mark',
       says=[mark(HJ_M, 'p053')], tags=['pronoun']),
     T("what bar is he attempting now", 'none', outcome='not_covered', focus='other', tags=['uncovered', 'live']),
     T("when is the women's high jump", 'contest_time', {'contest': 'ath-w-high-jump-final'}, focus='when',
       says=[hhmm('ath-w-high-jump-final')], tags=['new_question']),
     tags=['live'])
# 29 delegation Orrindel
conv(T("orrindel isles medals", 'delegation_medals', {'group': 'orrindel'}, focus='count',
       says=[count(gmed('orrindel')), rank('orrindel')], tags=['terse']),
     T("how many of them in gymnastics", 'delegation_medals', {'group': 'orrindel', 'sport': 'gymnastics'},
       focus='count', says=[count(gmed('orrindel', sport='gymnastics'))], tags=['pronoun', 'constraint']),
     T("who won the men's floor", 'podium', {'contest': 'gym-m-floor-final'}, focus='who',
       says=medal('gym-m-floor-final', 'gold'), tags=['new_question']),
     T("what did he score", 'competitor_result', {'competitor': 'p109', 'contest': 'gym-m-floor-final'}, focus='mark',
       says=[mark('gym-m-floor-final', 'p109')], tags=['pronoun']),
     tags=['delegation_fan'])
# 30 schedule today
conv(T("what's on today", 'schedule_day', {'date': D_TODAY}, focus='schedule', says=times_on(D_TODAY),
       tags=['relative_day']),
     T("and which of those are still going", 'under_way', {}, focus='status', says=[dname(c) for c in live()],
       tags=['pronoun', 'follow_up']),
     T("which finish first", 'none', outcome='not_covered', focus='when', tags=['uncovered']),
     tags=['programme'])
# 31 Dosavorn vs Galkace multi contests
conv(T("tell me about Lirust Dosavorn", 'competitor_profile', {'competitor': 'p001'}, focus='profile',
       says=['silver', mark(M100, 'p001')]),
     T("did he beat Galkace in the heat", 'head_to_head',
       {'competitor': 'p001', 'rival': 'p005', 'contest': 'ath-m-100m-heat-1'}, focus='whether',
       says=[ahead('ath-m-100m-heat-1', 'p001', 'p005')], tags=['pronoun', 'constraint']),
     T("and in the final, how far behind Galkace was he", 'competitor_margin', {'competitor': 'p001', 'contest': M100},
       focus='margin', says=[margin(M100, 'p001')[0]], tags=['pronoun', 'constraint']),
     tags=['compare'])
# 32 intern abbreviations swimming
conv(T("w 100 brst podium", 'podium', {'contest': 'swm-w-100m-breaststroke-final'}, focus='who',
       says=podium_names('swm-w-100m-breaststroke-final'), tags=['misspelling', 'terse']),
     T("m?", 'podium', {'contest': 'swm-m-100m-breaststroke-final'}, focus='who',
       says=podium_names('swm-m-100m-breaststroke-final'), tags=['ellipsis', 'terse']),
     T("dsq in that one?", 'none', outcome='not_covered', focus='other', tags=['uncovered', 'terse']),
     tags=['intern'])
# 33 next events for delegation member
nx = next_for('p243')
conv(T("when does Sovi Arkenlund race next", 'competitor_next', {'competitor': 'p243'}, focus='when',
       says=[hhmm(nx), venue(nx)], tags=['diacritics']),
     T("what does she row", 'competitor_sport', {'competitor': 'p243'}, focus='sport_of',
       says=[dname(nx)], tags=['pronoun']),
     T("which other crews are in that final", 'none', outcome='not_covered', focus='other',
       tags=['uncovered', 'pronoun', 'start_list']),
     tags=['rowing'])
# 34 voice Tetha
conv(T("tetha brell wick how many medals", 'competitor_medals', {'competitor': 'p210'}, focus='count',
       says=[count(person_medals('p210'))], tags=['voice', 'mishearing']),
     T("who was second behind her in the road race", 'contest_place', {'contest': 'cyc-w-road-race-final', 'place': '2'},
       focus='who', says=at_place('cyc-w-road-race-final', 2), tags=['pronoun', 'constraint']),
     T("and in the time trial", 'contest_place', {'contest': 'cyc-w-time-trial-final', 'place': '2'}, focus='who',
       says=at_place('cyc-w-time-trial-final', 2), never=at_place('cyc-w-road-race-final', 2), tags=['ellipsis']),
     tags=['commuter'])
# 35 not covered cluster
conv(T("how many countries have won at least one gold", 'none', outcome='not_covered', focus='count',
       tags=['uncovered']),
     T("fine, who leads the table then", 'medal_table_leader', {}, focus='who', says=leaders(), tags=['new_question']),
     T("how many golds ahead of second are they", 'none', outcome='not_covered', focus='margin',
       tags=['uncovered']),
     tags=['uncovered_mix'])
# 36 best mark round
v1, w1 = best('athletics', '100m', 'men')
conv(T("fastest men's 100 of the games", 'best_mark', {'discipline': 'athletics/100m', 'category': 'men'},
       focus='mark', says=[v1] + w1),
     T("what about just in the heats", 'best_mark', {'discipline': 'athletics/100m', 'category': 'men', 'round': 'heat'},
       focus='mark', says=[best('athletics', '100m', 'men', 'heat')[0]], never=[v1],
       tags=['ellipsis', 'constraint']),
     T("and for the women", 'best_mark', {'discipline': 'athletics/100m', 'category': 'women', 'round': 'heat'},
       focus='mark', says=[best('athletics', '100m', 'women', 'heat')[0]], tags=['ellipsis', 'constraint']),
     tags=['best_mark'])
# 37 long jump clarify
conv(T("long jump results", 'full_results', {}, outcome='clarify', focus='results',
       tags=['ambiguous', 'clarify', 'missing_slot']),
     T("mens", 'full_results', {'contest': 'ath-m-long-jump-final'}, focus='results',
       says=top('ath-m-long-jump-final', 3), tags=['ellipsis', 'contraction']),
     T("how far was the winner ahead", 'competitor_margin', {'competitor': 'p049', 'contest': 'ath-m-long-jump-final'},
       focus='margin', says=[margin('ath-m-long-jump-final', 'p049')[0]], tags=['follow_up']),
     tags=['clarify'])
# 38 parent swim
conv(T("my kid wants to know who won the women's 100 freestyle", 'podium', {'contest': 'swm-w-100m-freestyle-final'},
       focus='who', says=medal('swm-w-100m-freestyle-final', 'gold'), tags=['chatty']),
     T("where's she from", 'competitor_delegation', {'competitor': 'p197'}, focus='group_of',
       says=[gn(grp_of('p197'))], tags=['pronoun']),
     T("how many medals has she got in total", 'competitor_medals', {'competitor': 'p197'}, focus='count',
       says=[count(person_medals('p197'))], tags=['pronoun']),
     T("is she swimming again", 'competitor_next', {'competitor': 'p197'}, focus='when',
       says=[hhmm(next_for('p197'))], tags=['pronoun']),
     T("great thanks", 'thanks', {}, focus='chat', tags=['chat']),
     tags=['parent'])
# 39 Vastrelia fan
conv(T("team vastrelia - how many golds?", 'delegation_medals', {'group': 'vastrelia', 'award': 'gold'},
       focus='count', says=[count(gmed('vastrelia', 'gold'))], tags=['alias', 'constraint']),
     T("who won them", 'none', outcome='not_covered', focus='who', tags=['uncovered', 'pronoun']),
     T("how did Vastrelia do in the men's 400", 'delegation_in_event', {'group': 'vastrelia', 'contest': 'ath-m-400m-final'},
       focus='how_did', says=[nm('p023'), 'gold'], tags=['constraint']),
     T("what was his time", 'competitor_result', {'competitor': 'p023', 'contest': 'ath-m-400m-final'}, focus='mark',
       says=[mark('ath-m-400m-final', 'p023')], tags=['pronoun']),
     tags=['delegation_fan'])
# 40 women's marathon
conv(T("women's marathon podium", 'podium', {'contest': MAR_W}, focus='who', says=podium_names(MAR_W), tags=['terse']),
     T("how did Cidys Cusolick get on", 'competitor_result', {'competitor': 'p155', 'contest': MAR_W}, focus='how_did',
       never=['10th'], tags=['dnf']),
     T("why did she drop out", 'none', outcome='not_covered', focus='other', tags=['uncovered', 'pronoun']),
     tags=['dnf'])
# 41 not understood then fine
conv(T("blorp blorp", 'none', outcome='not_understood', focus='other', tags=['uncovered', 'gibberish']),
     T("sorry, my cat. who won the men's 400 metres", 'podium', {'contest': 'ath-m-400m-final'}, focus='who',
       says=medal('ath-m-400m-final', 'gold'), tags=['chatty']),
     T("and who came last", 'contest_place', {'contest': 'ath-m-400m-final', 'place': str(placed('ath-m-400m-final')[-1]['place'])},
       focus='who', says=[entry_name(placed('ath-m-400m-final')[-1])], tags=['ellipsis']),
     tags=['chat'])
# 42 head to head no contest shared
conv(T("did Thindust Zavindal beat Wanard Sindayne", 'head_to_head', {'competitor': 'p088', 'rival': 'p090'},
       focus='whether', says=[ahead('row-m-single-sculls-final', 'p088', 'p090')]),
     T("by what margin", 'competitor_margin', {'competitor': 'p088', 'contest': 'row-m-single-sculls-final'},
       focus='margin', says=[margin('row-m-single-sculls-final', 'p088')[0]], tags=['ellipsis']),
     T("which delegation is Sindayne from", 'competitor_delegation', {'competitor': 'p090'}, focus='group_of',
       says=[gn(grp_of('p090'))], tags=['partial']),
     tags=['compare'])
assert shared('p088', 'p090') == ['row-m-single-sculls-final']
# 43 gym men all around follow
conv(T("men's all around top 3", 'full_results', {'contest': 'gym-m-all-around-final', 'count': '3'}, focus='results',
       says=top('gym-m-all-around-final', 3), never=[entry_name(placed('gym-m-all-around-final')[3])],
       tags=['constraint']),
     T("how did Zovic Sondille do there", 'competitor_result', {'competitor': 'p115', 'contest': 'gym-m-all-around-final'},
       focus='how_did', says=[place('gym-m-all-around-final', 'p115'), mark('gym-m-all-around-final', 'p115')],
       tags=['constraint']),
     T("did he medal anywhere", 'competitor_medals', {'competitor': 'p115'}, focus='whether', says=['silver'],
       tags=['pronoun']),
     tags=['gymnastics'])
# 44 voice basketball women
conv(T("when is the womens basketball final", 'contest_time', {'contest': 'bkb-w-tournament-final'}, focus='when',
       says=[hhmm('bkb-w-tournament-final')], tags=['voice']),
     T("who is playing in it", 'none', outcome='not_covered', focus='other', tags=['uncovered', 'voice', 'start_list']),
     T("who won it", 'podium', {'contest': 'bkb-w-tournament-final'}, outcome='no_data', focus='who',
       tags=['uncovered', 'pronoun']),
     tags=['commuter'])
# 45 open/remaining
conv(T("which medal events are still to come", 'none', outcome='not_covered', focus='open', tags=['uncovered']),
     T("what's on on the 16th then", 'schedule_day', {'date': '2027-08-16'}, focus='schedule',
       says=times_on('2027-08-16'), tags=['follow_up']),
     T("just rowing", 'schedule_day', {'date': '2027-08-16', 'sport': 'rowing'}, focus='schedule',
       says=times_on('2027-08-16', 'rowing'), never=[t for t in times_on('2027-08-16') if t not in times_on('2027-08-16', 'rowing')],
       tags=['ellipsis', 'constraint']),
     tags=['what_left'])
# 46 tied silver
conv(T("who won the women's 200 free", 'podium', {'contest': 'swm-w-200m-freestyle-final'}, focus='who',
       says=medal('swm-w-200m-freestyle-final', 'gold')),
     T("and who took silver", 'medalist', {'contest': 'swm-w-200m-freestyle-final', 'award': 'silver'}, focus='who',
       says=medal('swm-w-200m-freestyle-final', 'silver'), tags=['ellipsis', 'tie']),
     T("what were their times", 'full_results', {'contest': 'swm-w-200m-freestyle-final'}, focus='mark',
       says=[mark('swm-w-200m-freestyle-final', 'p196')], tags=['pronoun']),
     tags=['tie'])


# ================================================================ checks
CARD = {
    'best_mark': {'discipline', 'category', 'round'}, 'competitor_delegation': {'competitor'},
    'competitor_margin': {'competitor', 'contest'}, 'competitor_medals': {'competitor', 'award'},
    'competitor_next': {'competitor'}, 'competitor_profile': {'competitor'},
    'competitor_result': {'competitor', 'contest'}, 'competitor_sport': {'competitor'},
    'contest_place': {'contest', 'place'}, 'contest_time': {'contest'},
    'delegation_in_event': {'group', 'contest'}, 'delegation_medals': {'group', 'sport', 'date', 'award'},
    'full_results': {'contest', 'count'}, 'greeting': set(), 'head_to_head': {'competitor', 'rival', 'contest'},
    'help': set(), 'live_leader': {'contest'}, 'medal_table_leader': {'sport', 'date', 'award'},
    'medal_table_top': {'sport', 'date', 'award', 'count'}, 'medalist': {'contest', 'award'},
    'most_medals': {'sport', 'date', 'award'}, 'podium': {'contest', 'award'},
    'schedule_day': {'date', 'sport'}, 'thanks': set(), 'under_way': {'sport'},
}
FIELDS = {'ask', 'intent', 'slots', 'outcome', 'focus', 'says', 'never', 'tags'}
OUTCOMES = {'answered', 'clarify', 'no_data', 'not_covered', 'not_understood'}
FOCI = {'who', 'how_did', 'results', 'count', 'rank', 'table', 'margin', 'mark', 'when', 'where', 'schedule',
        'status', 'whether', 'compare', 'group_of', 'sport_of', 'profile', 'open', 'chat', 'other'}
DISCS = {f"{s['id']}/{d['id']}" for s in SPORTS.values() for d in s['disciplines']}


def check_turn(t):
    assert set(t) <= FIELDS, t
    assert t['outcome'] in OUTCOMES and t.get('focus') in FOCI, t
    if t['intent'] == 'none':
        assert 'slots' not in t and t['outcome'] in ('not_covered', 'not_understood'), t
        return
    assert t['intent'] in CARD, t
    for k, v in t['slots'].items():
        assert k in CARD[t['intent']], (k, t)
        ok = {'competitor': lambda: v in COMP, 'rival': lambda: v in COMP, 'contest': lambda: v in CON,
              'group': lambda: v in GROUPS, 'sport': lambda: v in SPORTS, 'award': lambda: v in AWARDS,
              'category': lambda: v in ('men', 'women'), 'discipline': lambda: v in DISCS,
              'round': lambda: v in ('heat', 'final'), 'date': lambda: bool(datetime.date.fromisoformat(v)),
              'count': lambda: v.isdigit(), 'place': lambda: v.isdigit()}[k]()
        assert ok, (k, v, t)
    if t['outcome'] == 'answered' and t['intent'] not in ('greeting', 'help', 'thanks', 'under_way',
                                                            'delegation_medals', 'competitor_medals',
                                                            'competitor_result'):
        assert t.get('says') or t.get('never'), t


for c in CASES:
    if 'conversation' in c:
        assert set(c) == {'conversation', 'tags'}
        for t in c['conversation']:
            check_turn(t)
    else:
        check_turn(c)


# ================================================================ write
def main():
    n_turns = 0
    n_conv = 0
    uncovered = 0
    for c in CASES:
        turns = c['conversation'] if 'conversation' in c else [c]
        if 'conversation' in c:
            n_conv += 1
            assert 2 <= len(turns) <= 6
        for t in turns:
            n_turns += 1
            if t['intent'] == 'none' or t.get('outcome') == 'no_data':
                uncovered += 1
            assert '_tags' not in t
    header = (
        "# Blind question set, round 5 -- scenario: games\n"
        f"# Moment: {CLOCK.strftime('%A %d %B %Y, %H:%M')} (+01:00, Europe/Lisbon); data as of {SCEN['as_of']}\n"
        "# Written by tests/eval/blind/round5/label_games.py from dataset-demo/games/*.json\n"
        f"# {len(CASES)} cases, {n_turns} turns, {n_conv} conversations, "
        f"{uncovered} uncovered turns ({100.0 * uncovered / n_turns:.1f}%)\n"
    )
    out = os.path.join(HERE, 'games.yaml')
    with open(out, 'w', encoding='utf-8') as f:
        f.write(header)
        yaml.safe_dump(CASES, f, allow_unicode=True, sort_keys=False, width=110, default_flow_style=None)
    print(header.strip())


if __name__ == '__main__':
    main()
