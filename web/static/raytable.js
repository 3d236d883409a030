// raytable.js: the page works without this script; with it, edits apply without a full reload and
// every gap gets a slider whose dragging previews the design live. No framework, no build step.
(function () {
  'use strict';
  if (!window.fetch || !window.DOMParser || !window.URLSearchParams) {
    return;
  }

  var generation = 0; // bumped by every stored edit; older previews are then ignored
  var previewBusy = false; // at most one preview request in flight
  var previewQueued = false; // a newer state is waiting: send it when the current one returns
  var plainSubmit = false; // set when fetch failed, to let the browser post the form itself

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

  // swapPage replaces the page's main region and title with those of a fetched page.
  function swapPage(html) {
    var doc = new DOMParser().parseFromString(html, 'text/html');
    var next = doc.querySelector('main');
    var main = document.querySelector('main');
    if (!next || !main) {
      return false;
    }
    main.replaceWith(document.adoptNode(next));
    document.title = doc.title;
    addSliders();
    return true;
  }

  // submitEdit posts the form as a stored edit and shows the page it leads to.
  function submitEdit(form, submitter) {
    generation++;
    previewQueued = false;
    setBusy(true);
    // getAttribute, not form.action: the buttons named "action" shadow that property.
    fetch(form.getAttribute('action'), { method: 'POST', body: formBody(form, submitter), credentials: 'same-origin' })
      .then(function (resp) {
        return resp.text().then(function (html) {
          if (!swapPage(html)) {
            throw new Error('unexpected answer');
          }
          if (resp.ok && resp.url && resp.url !== window.location.href) {
            window.history.pushState({ raytable: true }, '', resp.url);
          }
        });
      })
      .catch(function () {
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

  window.addEventListener('popstate', function () {
    window.location.reload();
  });

  if (document.readyState === 'loading') {
    document.addEventListener('DOMContentLoaded', addSliders);
  } else {
    addSliders();
  }
})();
