// The editors' desk: asks the service as a reader would and shows the reply
// as the chosen channel shapes it, with how the message was understood; and
// lists the unanswered questions through the admin API.
//
// Everything the service or a reader wrote goes into the page as text
// (textContent, createTextNode), never as markup: replies echo readers'
// words, and the content security policy is a second line, not the first.
"use strict";

(function () {
  const $ = (id) => document.getElementById(id);

  // Random hex from the platform's generator (also outside secure contexts,
  // unlike crypto.randomUUID).
  function randomHex(bytes) {
    const a = new Uint8Array(bytes);
    crypto.getRandomValues(a);
    return Array.from(a, (b) => b.toString(16).padStart(2, "0")).join("");
  }

  // A new reader id per page load and per "New conversation": the service
  // keeps one conversation per reader and channel.
  let reader = "desk-" + randomHex(8);
  let channel = $("channel").value;
  let busy = false;

  function el(tag, className, text) {
    const e = document.createElement(tag);
    if (className) e.className = className;
    if (text !== undefined && text !== null) e.textContent = String(text);
    return e;
  }

  function showError(node, message) {
    node.textContent = message;
    node.hidden = false;
  }

  function hideError(node) {
    node.textContent = "";
    node.hidden = true;
  }

  // The body's error message in the service's error format, or a sentence
  // saying what came back instead.
  function errorMessage(status, body) {
    if (body && body.error && typeof body.error.message === "string") {
      return body.error.message + " (" + status + " " + (body.error.code || "error") + ")";
    }
    return "the service answered " + status + " without an error message";
  }

  async function readJson(response) {
    try {
      return await response.json();
    } catch (_) {
      return null;
    }
  }

  // ---- Views ----

  const tabs = [$("tab-ask"), $("tab-unanswered")];

  function selectTab(tab) {
    for (const t of tabs) {
      const on = t === tab;
      t.setAttribute("aria-selected", on ? "true" : "false");
      t.tabIndex = on ? 0 : -1;
      $(t.getAttribute("aria-controls")).hidden = !on;
    }
  }

  tabs.forEach((tab, i) => {
    tab.addEventListener("click", () => selectTab(tab));
    // Arrow keys move between tabs, as in any tab list.
    tab.addEventListener("keydown", (ev) => {
      if (ev.key !== "ArrowRight" && ev.key !== "ArrowLeft") return;
      const next = tabs[(i + (ev.key === "ArrowRight" ? 1 : tabs.length - 1)) % tabs.length];
      selectTab(next);
      next.focus();
    });
  });

  // ---- Asking ----

  function showReader() {
    $("reader-id").textContent = reader;
  }

  // Markdown as the chat channel sends it: plain text with **bold** runs.
  // Bold runs become <strong> elements holding text; an unpaired ** stays
  // as written.
  function appendMarkdown(into, markdown) {
    const parts = markdown.split("**");
    const paired = parts.length % 2 === 1;
    parts.forEach((part, i) => {
      const last = i === parts.length - 1;
      if (i % 2 === 1 && (paired || !last)) {
        into.append(el("strong", null, part));
      } else {
        into.append(document.createTextNode((i % 2 === 1 ? "**" : "") + part));
      }
    });
  }

  function choiceButtons(className, label, texts) {
    const box = el("div", "choices " + className);
    box.setAttribute("role", "group");
    box.setAttribute("aria-label", label);
    for (const text of texts) {
      const b = el("button", null, text);
      b.type = "button";
      b.addEventListener("click", () => ask(text));
      box.append(b);
    }
    return box;
  }

  // The reply as its channel shapes it. What is shown follows the fields
  // the reply carries, so a channel added in channels.yaml is shown by what
  // its profile gives (markdown, SSML, an SMS fit, quick replies).
  function renderReply(box, r) {
    box.replaceChildren();
    box.append(el("p", "reply-label", r.channel + (r.ssml ? " · spoken" : "")));
    const text = el("p", "reply-text");
    if (typeof r.markdown === "string") {
      appendMarkdown(text, r.markdown);
    } else {
      text.textContent = r.text;
    }
    box.append(text);
    if (r.sms) {
      const fits = r.sms.units <= r.sms.limit;
      const info = el(
        "p",
        "sms-info" + (fits ? "" : " over"),
        "One SMS segment, " + r.sms.encoding + ": " + r.sms.units + " of " + r.sms.limit + " units" +
          (fits ? "" : " (too long)"),
      );
      box.append(info);
    }
    if (typeof r.ssml === "string") {
      const pre = el("pre", "ssml", r.ssml);
      pre.setAttribute("aria-label", "SSML document");
      box.append(pre);
    }
    if (Array.isArray(r.options) && r.options.length > 0) {
      box.append(choiceButtons("options", "Options offered", r.options.map((o) => o.text)));
    }
    if (Array.isArray(r.quick_replies) && r.quick_replies.length > 0) {
      box.append(choiceButtons("quick-replies", "Quick replies", r.quick_replies));
    }
    // The fields as sent, for checking wording exactly.
    const raw = el("details", "raw");
    raw.append(el("summary", null, "Fields as sent"));
    const dl = el("dl");
    dl.append(el("dt", null, "text"), el("dd", "raw-text", r.text));
    if (typeof r.markdown === "string") dl.append(el("dt", null, "markdown"), el("dd", "raw-markdown", r.markdown));
    if (r.degraded) dl.append(el("dt", null, "degraded"), el("dd", null, "answered without conversation context"));
    raw.append(dl);
    box.append(raw);
  }

  function cell(row, text, className) {
    const td = el("td", className || null, text);
    row.append(td);
    return td;
  }

  function fixed2(n) {
    return typeof n === "number" && isFinite(n) ? n.toFixed(2) : "—";
  }

  function renderUnderstanding(r) {
    $("understanding-empty").hidden = true;
    $("understanding").hidden = false;
    const intent = $("u-intent");
    intent.textContent = r.intent ? r.intent : "not understood";
    intent.classList.toggle("none", !r.intent);
    const candidates = Array.isArray(r.candidates) ? r.candidates : [];
    const chosen = candidates.find((c) => c.intent === r.intent);
    $("u-example").textContent = chosen ? chosen.example + " (score " + fixed2(chosen.score) + ")" : "—";
    // The operation's own outcome name, when it says more than the class.
    $("u-outcome").textContent = r.outcome + (r.detail && r.detail !== r.outcome ? " · " + r.detail : "");
    $("u-confidence").textContent = fixed2(r.confidence);
    $("u-data").textContent = "version " + r.dataset_version + ", as of " + r.as_of + (r.degraded ? " (degraded)" : "");

    const slots = $("u-slots").tBodies[0];
    slots.replaceChildren();
    const names = Object.keys(r.slots || {});
    for (const name of names) {
      const s = r.slots[name];
      const row = el("tr");
      cell(row, name);
      cell(row, s.kind);
      cell(row, s.value);
      cell(row, s.text);
      slots.append(row);
    }
    $("u-slots").hidden = names.length === 0;
    $("u-slots-none").hidden = names.length > 0;

    const runners = candidates.filter((c) => c !== chosen);
    const body = $("u-runners-up").tBodies[0];
    body.replaceChildren();
    for (const c of runners) {
      const row = el("tr");
      cell(row, c.intent);
      cell(row, fixed2(c.score), "number");
      cell(row, c.example);
      cell(row, Array.isArray(c.shared) ? c.shared.join(" ") : "");
      body.append(row);
    }
    $("u-runners-up").hidden = runners.length === 0;
    $("u-runners-up-none").hidden = runners.length > 0;
  }

  function scrollToEnd() {
    const t = $("thread");
    t.scrollTop = t.scrollHeight;
  }

  async function ask(text) {
    const question = text.trim();
    if (question === "" || busy) return;
    busy = true;
    $("send").disabled = true;
    hideError($("ask-error"));

    const turn = el("article", "turn");
    turn.dataset.state = "pending";
    turn.dataset.channel = channel;
    turn.append(el("p", "question", question));
    const reply = el("div", "reply", "…");
    turn.append(reply);
    $("thread").append(turn);
    scrollToEnd();

    try {
      // From the origin, not relative: a page opened as
      // name:token@host/desk (Basic sign-in) has a base URL with credentials, from
      // which a browser refuses to build a request.
      const response = await fetch(location.origin + "/v1/messages", {
        method: "POST",
        headers: { "content-type": "application/json" },
        // explain: the runner-up intents (candidates) are what this page shows.
        body: JSON.stringify({ user: reader, text: question, channel: channel, message_id: "desk-" + randomHex(12), explain: true }),
      });
      const body = await readJson(response);
      if (response.ok && body && typeof body.text === "string") {
        renderReply(reply, body);
        renderUnderstanding(body);
        turn.dataset.state = "done";
      } else {
        const message = response.ok ? "the service sent a reply this page cannot read" : errorMessage(response.status, body);
        reply.textContent = "Error: " + message;
        turn.dataset.state = "error";
        showError($("ask-error"), message);
      }
    } catch (e) {
      const message = "could not reach the service: " + e.message;
      reply.textContent = "Error: " + message;
      turn.dataset.state = "error";
      showError($("ask-error"), message);
    } finally {
      busy = false;
      $("send").disabled = false;
      scrollToEnd();
    }
  }

  $("ask-form").addEventListener("submit", (ev) => {
    ev.preventDefault();
    const input = $("question");
    const text = input.value;
    if (text.trim() === "" || busy) return;
    input.value = "";
    ask(text);
    input.focus();
  });

  $("channel").addEventListener("change", () => {
    channel = $("channel").value;
    const note = el("p", "channel-switch", "Now on " + channel + ": a conversation of its own");
    $("thread").append(note);
    scrollToEnd();
    $("question").focus();
  });

  $("new-conversation").addEventListener("click", () => {
    reader = "desk-" + randomHex(8);
    showReader();
    $("thread").replaceChildren();
    hideError($("ask-error"));
    $("understanding").hidden = true;
    $("understanding-empty").hidden = false;
    $("question").focus();
  });

  // ---- Unanswered ----

  function adminError(status, body) {
    const code = body && body.error ? body.error.code : "";
    if (status === 403 && code === "admin_off") {
      return "The admin API is off on this server: start it with --admin-token (or TIDINGS_ADMIN_TOKEN) to see this list.";
    }
    if (status === 401) {
      return "The server refused this admin token: check it and load again.";
    }
    return errorMessage(status, body);
  }

  $("unanswered-form").addEventListener("submit", async (ev) => {
    ev.preventDefault();
    const error = $("unanswered-error");
    const status = $("unanswered-status");
    const table = $("unanswered-table");
    hideError(error);
    const limit = Number.parseInt($("unanswered-limit").value, 10);
    if (!Number.isInteger(limit) || limit < 1) {
      showError(error, "How many must be a whole number of 1 or more.");
      return;
    }
    // Read from the field each time: the token lives only in this page.
    const token = $("admin-token").value.trim();
    const headers = token ? { authorization: "Bearer " + token } : {};
    $("unanswered-load").disabled = true;
    status.textContent = "Loading…";
    try {
      const response = await fetch(location.origin + "/v1/admin/unanswered?limit=" + limit, { headers: headers });
      const body = await readJson(response);
      if (!response.ok || !body || !Array.isArray(body.unanswered)) {
        table.hidden = true;
        status.textContent = "";
        showError(error, response.ok ? "the service sent a list this page cannot read" : adminError(response.status, body));
        return;
      }
      const rows = table.tBodies[0];
      rows.replaceChildren();
      for (const q of body.unanswered) {
        const row = el("tr");
        cell(row, q.text);
        cell(row, q.kind === "abandoned" ? "asked back, then left" : q.kind === "not_understood" ? "not understood" : q.kind);
        cell(row, q.count, "number");
        rows.append(row);
      }
      table.hidden = body.unanswered.length === 0;
      status.textContent =
        body.unanswered.length === 0
          ? "Nothing unanswered yet."
          : body.unanswered.length + " question" + (body.unanswered.length === 1 ? "" : "s") + ", most asked first; loaded " +
            new Date().toLocaleTimeString() + ".";
    } catch (e) {
      table.hidden = true;
      status.textContent = "";
      showError(error, "could not reach the service: " + e.message);
    } finally {
      $("unanswered-load").disabled = false;
    }
  });

  showReader();
})();
