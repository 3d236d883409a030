package server

import (
	"bytes"
	"encoding/json"
	"net/http"

	"raytable/web/diagram"
)

func (s *Server) benchJSON(w http.ResponseWriter, r *http.Request) {
	d, err := s.load(r)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	w.Header().Set("Content-Type", "application/json")
	w.Write(d.rev.Bench)
}

// reportJSON writes the report exactly as `raytable report --json` prints it.
func (s *Server) reportJSON(w http.ResponseWriter, r *http.Request) {
	d, err := s.load(r)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	rep, err := analyze(d.bench)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	var buf bytes.Buffer
	enc := json.NewEncoder(&buf)
	enc.SetIndent("", "  ")
	if err := enc.Encode(rep); err != nil {
		s.fail(w, r, err)
		return
	}
	w.Header().Set("Content-Type", "application/json")
	w.Write(buf.Bytes())
}

func writeSVG(w http.ResponseWriter, svg []byte) {
	w.Header().Set("Content-Type", "image/svg+xml")
	w.Write(svg)
}

func (s *Server) sideSVG(w http.ResponseWriter, r *http.Request) {
	d, err := s.load(r)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	rep, err := analyze(d.bench)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	writeSVG(w, diagram.Side(rep, sideOptions(rep, pageSideWidthPX, pageSideHeightPX, r.URL.Query().Get("paraxial") == "1")))
}

func (s *Server) tableSVG(w http.ResponseWriter, r *http.Request) {
	d, err := s.load(r)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	rep, err := analyze(d.bench)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	writeSVG(w, diagram.Table(d.bench, rep, diagram.TableOptions{WidthPX: pageTableWidthPX}))
}

// planSVG is the printable plan: its size is in millimetres, so printing at 100 % gives true size.
func (s *Server) planSVG(w http.ResponseWriter, r *http.Request) {
	d, err := s.load(r)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	rep, err := analyze(d.bench)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	writeSVG(w, diagram.Plan(d.bench, rep))
}
