// raytable.js: the page works without this script; with it, edits apply without a full reload and
// every gap gets a slider whose dragging previews the design live. No framework, no build step.
(function () {
  'use strict';
  if (!window.fetch || !window.DOMParser || !window.URLSearchParams) {
    return;
  }

  var generation = 0; // bumped when a save is sent and when it is shown; older previews are ignored
  var saveSeq = 0; // numbers the saves; only the answer to the latest one is shown
  var previewBusy = false; // at most one preview request in flight
  var previewQueued = false; // a newer state is waiting: send it when the current one returns
  var plainSubmit = false; // set when fetch failed, to let the browser post the form itself
  var shownURL = withoutHash(window.location.href); // the page whose content is on screen

  function withoutHash(url) {
    var i = url.indexOf('#');
    return i < 0 ? url : url.slice(0, i);
  }

  function benchForm() {
    return document.getElementById('bench-form');
  }

  // formBody encodes the form like the browser would, with the pressed button's name and value.
  function formBody(form, submitter) {
    var data = new FormData(form);
    if (submitter && submitter.name) {
      data.set(submitter.name, submitter.value);
    }
    return new URLSearchParams(data);
  }

  function setBusy(on) {
    var result = document.getElementById('result');
    if (result) {
      result.classList.toggle('busy', on);
    }
  }

  // focusKey describes the focused control so that its counterpart can be focused again once the
  // page is swapped: a slider by the gap it drives, a button by name and value, a field by name.
  function focusKey() {
    var el = document.activeElement;
    if (!el || !el.closest || !el.closest('main')) {
      return null;
    }
    if (el.type === 'range' && el.dataset.for) {
      return { slider: el.dataset.for };
    }
    if (el.name) {
      return { name: el.name, value: el.tagName === 'BUTTON' ? el.value : null };
    }
    return null;
  }

  function restoreFocus(key) {
    if (!key) {
      return;
    }
    var controls = document.querySelectorAll('main input, main select, main textarea, main button');
    for (var i = 0; i < controls.length; i++) {
      var c = controls[i];
      var match = key.slider ? c.type === 'range' && c.dataset.for === key.slider
        : c.name === key.name && c.type !== 'range' && (key.value === null || c.value === key.value);
      if (match) {
        c.focus({ preventScroll: true });
        return;
      }
    }
  }

  // swapPage replaces the page's main region and title with those of a fetched page, keeping the
  // keyboard focus on the same control.
  function swapPage(html) {
    var doc = new DOMParser().parseFromString(html, 'text/html');
    var next = doc.querySelector('main');
    var main = document.querySelector('main');
    if (!next || !main) {
      return false;
    }
    var key = focusKey();
    main.replaceWith(document.adoptNode(next));
    document.title = doc.title;
    addSliders();
    restoreFocus(key);
    return true;
  }

  // showSaveError says beside the save button why a save failed, leaving the form as typed. An
  // error page (413, 500, ...) must not replace the form: what the user typed would be lost.
  function showSaveError(form, html, status) {
    var doc = new DOMParser().parseFromString(html, 'text/html');
    var msg = doc.querySelector('[data-testid=error-message]');
    var text = 'Nothing was saved (' + status + '): ' +
      (msg && msg.textContent.trim() ? msg.textContent.trim() : 'the server could not take this edit.');
    var box = form.querySelector('[data-testid=save-error]');
    if (!box) {
      box = document.createElement('p');
      box.className = 'invalid save-error';
      box.setAttribute('role', 'alert');
      box.dataset.testid = 'save-error';
      (form.querySelector('.form-head') || form).appendChild(box);
    }
    box.textContent = text;
  }

  // submitEdit posts the form as a stored edit and shows the page it leads to. When saves overlap
  // (a slider released twice quickly), only the answer to the latest one is shown.
  function submitEdit(form, submitter) {
    generation++;
    var seq = ++saveSeq;
    previewQueued = false;
    setBusy(true);
    // getAttribute, not form.action: the buttons named "action" shadow that property.
    fetch(form.getAttribute('action'), { method: 'POST', body: formBody(form, submitter), credentials: 'same-origin' })
      .then(function (resp) {
        return resp.text().then(function (html) {
          if (seq !== saveSeq) {
            return; // a newer save is on its way; its answer is the one to show
          }
          if (!resp.ok && resp.status !== 422) {
            setBusy(false);
            showSaveError(form, html, resp.status);
            return;
          }
          if (!swapPage(html)) {
            throw new Error('unexpected answer');
          }
          generation++; // previews sent while this save was on its way show an older form
          if (resp.ok && resp.url && withoutHash(resp.url) !== shownURL) {
            window.history.pushState({ raytable: true }, '', resp.url);
            shownURL = withoutHash(resp.url);
          }
        });
      })
      .catch(function () {
        if (seq !== saveSeq) {
          return;
        }
        // Let the browser post the form itself: the page works without the script too.
        plainSubmit = true;
        if (form.requestSubmit) {
          form.requestSubmit(submitter || undefined);
        } else {
          form.submit();
        }
      });
  }

  // requestPreview computes the current form without storing it and swaps in the result. Requests
  // are coalesced: while one is in flight, only the latest state is sent afterwards.
  function requestPreview() {
    var form = benchForm();
    if (!form || !form.dataset.preview) {
      return;
    }
    if (previewBusy) {
      previewQueued = true;
      return;
    }
    previewBusy = true;
    var started = generation;
    fetch(form.dataset.preview, { method: 'POST', body: formBody(form), credentials: 'same-origin' })
      .then(function (resp) {
        return resp.text().then(function (html) {
          var result = document.getElementById('result');
          if (started === generation && result && (resp.ok || resp.status === 422)) {
            result.innerHTML = html;
          }
        });
      })
      .catch(function () {})
      .then(function () {
        previewBusy = false;
        if (previewQueued) {
          previewQueued = false;
          requestPreview();
        }
      });
  }

  // addSliders gives every gap input a range slider: dragging previews, releasing stores.
  function addSliders() {
    var form = benchForm();
    if (!form) {
      return;
    }
    var inputs = form.querySelectorAll('input[type=text][name$=".gap_mm"]');
    Array.prototype.forEach.call(inputs, function (input) {
      var field = input.closest('.field');
      if (!field || field.querySelector('input[type=range]')) {
        return;
      }
      var value = parseFloat(input.value);
      if (!isFinite(value)) {
        value = 0;
      }
      var slider = document.createElement('input');
      slider.type = 'range';
      slider.className = 'slider';
      slider.min = '0';
      slider.max = String(Math.max(50, Math.ceil(value * 2)));
      slider.step = '0.5';
      slider.value = String(value);
      slider.setAttribute('aria-label', 'drag to change ' + input.name);
      slider.dataset.for = input.name;
      slider.addEventListener('input', function () {
        input.value = slider.value;
        requestPreview();
      });
      slider.addEventListener('change', function () {
        input.value = slider.value;
        submitEdit(form, form.querySelector('button[name=action][value=save]'));
      });
      field.appendChild(slider);
    });
  }

  document.addEventListener('submit', function (ev) {
    var form = ev.target;
    if (form.id !== 'bench-form' || plainSubmit) {
      return;
    }
    ev.preventDefault();
    submitEdit(form, ev.submitter);
  });

  // Back and forward between revisions this script pushed reload that revision. A jump to an
  // anchor on the same page also fires popstate; it must not reload (and lose typed input).
  window.addEventListener('popstate', function () {
    if (withoutHash(window.location.href) !== shownURL) {
      window.location.reload();
    }
  });

  if (document.readyState === 'loading') {
    document.addEventListener('DOMContentLoaded', addSliders);
  } else {
    addSliders();
  }
})();
