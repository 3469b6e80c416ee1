// Eonscale visitor pages: the one small script (no framework). It adds two things the pages do
// not need to be read: "find the nearest marker" (asks for the location only when pressed) and the
// offline copy (a service worker keeps the exhibit; done by itself after load unless the browser
// asks to save data, or with the button on the exhibit page). Texts come from data-t-* attributes
// in the page's language.
(function () {
  "use strict";
  var root = document.querySelector("[data-visit-org]");
  if (!root) return;
  var lang = root.getAttribute("data-lang") || document.documentElement.lang || "en";

  function fill(template, values) {
    return String(template || "").replace(/\{(\w+)\}/g, function (whole, key) {
      return key in values ? String(values[key]) : whole;
    });
  }
  function when(iso) {
    try {
      return new Date(iso).toLocaleString(lang === "de" ? "de-DE" : "en-GB", { dateStyle: "medium", timeStyle: "short" });
    } catch (_e) {
      return iso;
    }
  }
  function metres(m, units) {
    if (units === "us") {
      var ft = m / 0.3048;
      return ft >= 5280 ? (ft / 5280).toFixed(1) + " mi" : Math.round(ft) + " ft";
    }
    return m >= 1000 ? (m / 1000).toFixed(1) + " km" : Math.round(m) + " m";
  }

  // ---- nearest marker along the route ----
  var near = document.getElementById("visit-nearest");
  if (near) {
    var data = JSON.parse(near.getAttribute("data-nearest"));
    var out = near.querySelector("[data-nearest-out]");
    var units = near.getAttribute("data-units");
    var t = function (k) {
      return near.getAttribute("data-t-" + k);
    };
    near.hidden = false;
    near.querySelector("button").addEventListener("click", function () {
      if (!("geolocation" in navigator)) {
        out.textContent = t("unsupported");
        return;
      }
      out.textContent = t("asking");
      navigator.geolocation.getCurrentPosition(
        function (pos) {
          var f = data.frame;
          var x = (pos.coords.longitude - f.lon0) * f.kx;
          var y = (pos.coords.latitude - f.lat0) * f.ky;
          var tr = data.track;
          var best = Math.hypot(x - tr[0], y - tr[1]);
          var along = tr[2];
          // The closest point of the track, and how far along the route it is.
          for (var k = 0; k + 5 < tr.length; k += 3) {
            var dx = tr[k + 3] - tr[k], dy = tr[k + 4] - tr[k + 1];
            var len2 = dx * dx + dy * dy;
            var u = len2 > 0 ? Math.min(1, Math.max(0, ((x - tr[k]) * dx + (y - tr[k + 1]) * dy) / len2)) : 0;
            var d = Math.hypot(x - (tr[k] + u * dx), y - (tr[k + 1] + u * dy));
            if (d < best) {
              best = d;
              along = tr[k + 2] + u * (tr[k + 5] - tr[k + 2]);
            }
          }
          var pick = data.markers[0];
          data.markers.forEach(function (m) {
            if (Math.abs(m[1] - along) < Math.abs(pick[1] - along)) pick = m;
          });
          out.textContent = "";
          var a = document.createElement("a");
          a.href = pick[3];
          a.textContent = fill(t("found"), { number: pick[0], label: pick[2], distance: metres(Math.abs(pick[1] - along), units) });
          out.appendChild(a);
          if (best > 25) out.appendChild(document.createTextNode(" " + fill(t("off"), { distance: metres(best, units) })));
        },
        function (err) {
          out.textContent = err && err.code === 1 ? t("denied") : t("unavailable");
        },
        { enableHighAccuracy: true, timeout: 20000, maximumAge: 30000 },
      );
    });
  }

  // ---- offline copy ----
  if (!("serviceWorker" in navigator) || !("caches" in window)) return;
  var org = root.getAttribute("data-visit-org");
  var slug = root.getAttribute("data-visit-slug");
  var version = root.getAttribute("data-visit-version");
  var urls = JSON.parse(root.getAttribute("data-precache") || "[]");
  var note = document.getElementById("visit-offline");
  var section = document.getElementById("visit-keep");
  var keepOut = section && section.querySelector("[data-keep-out]");
  var say = function (k, values) {
    return fill(root.getAttribute("data-t-" + k), values || {});
  };

  function keptMeta() {
    return caches.keys().then(function (keys) {
      var name = keys.filter(function (k) {
        return k.indexOf("eonscale-visit:" + org + "/" + slug + "#") === 0;
      })[0];
      if (!name) return null;
      return caches.open(name).then(function (c) {
        return c.match("/visit/__kept__").then(function (r) {
          return r ? r.json() : null;
        });
      });
    });
  }

  // "You are offline": no network at all, or this page came from the kept copy (a signal too weak to answer).
  function askWorker(message) {
    return navigator.serviceWorker.ready.then(function (reg) {
      return new Promise(function (resolve) {
        var channel = new MessageChannel();
        channel.port1.onmessage = function (e) {
          resolve(e.data);
        };
        reg.active.postMessage(message, [channel.port2]);
      });
    });
  }
  keptMeta().then(function (meta) {
    if (!meta || !note) return;
    var show = function () {
      note.textContent = say("showing", { time: when(meta.savedAt) });
      note.hidden = false;
    };
    if (!navigator.onLine) show();
    else if (navigator.serviceWorker.controller)
      askWorker({ type: "from-kept?", url: location.href }).then(function (answer) {
        if (answer && answer.fromKept) show();
      });
  });

  if (!urls.length) return;
  var assets = ["/visit.js"];
  document.querySelectorAll('link[rel="stylesheet"]').forEach(function (l) {
    assets.push(new URL(l.href).pathname);
  });

  function keep() {
    if (keepOut) keepOut.textContent = say("saving");
    return askWorker({ type: "keep", org: org, slug: slug, version: version, urls: urls.concat(assets) }).then(function (result) {
      if (keepOut) keepOut.textContent = result.ok ? say("saved", { time: when(result.savedAt) }) : say("failed", { reason: result.reason });
      document.documentElement.setAttribute("data-kept", result.ok ? "yes" : "no");
      return result;
    });
  }

  window.addEventListener("load", function () {
    navigator.serviceWorker.register("/sw.js", { scope: "/visit/" }).then(function () {
      if (section) {
        section.hidden = false;
        section.querySelector("button").addEventListener("click", keep);
      }
      var saveData = navigator.connection && navigator.connection.saveData;
      keptMeta().then(function (meta) {
        // By itself: only online, and only when nothing or an older publication is kept. A newer
        // publication always replaces a kept copy; a first copy waits for a tap under Save-Data.
        if (!navigator.onLine) return;
        if (meta && meta.version === version) {
          if (keepOut) keepOut.textContent = say("saved", { time: when(meta.savedAt) });
          document.documentElement.setAttribute("data-kept", "yes");
          return;
        }
        if (meta || !saveData) keep();
      });
    });
  });
})();
