package server

import (
	"net/http"
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
	data, err := s.reportJSONBytes(d)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	w.Header().Set("Content-Type", "application/json")
	w.Write(data)
}

func writeSVG(w http.ResponseWriter, svg []byte) {
	w.Header().Set("Content-Type", "image/svg+xml")
	w.Write(svg)
}

// drawing answers one standalone SVG of the revision in the URL.
func (s *Server) drawing(w http.ResponseWriter, r *http.Request, kind string) {
	d, err := s.load(r)
	if err != nil {
		s.fail(w, r, err)
		return
	}
	svg, err := s.revSVG(d, kind, r.URL.Query().Get("paraxial") == "1", r.URL.Query().Get("arm"))
	if err != nil {
		s.fail(w, r, err)
		return
	}
	writeSVG(w, svg)
}

func (s *Server) sideSVG(w http.ResponseWriter, r *http.Request)  { s.drawing(w, r, artSideSVG) }
func (s *Server) tableSVG(w http.ResponseWriter, r *http.Request) { s.drawing(w, r, artTableSVG) }

// planSVG is the printable plan: its size is in millimetres, so printing at 100 % gives true size.
func (s *Server) planSVG(w http.ResponseWriter, r *http.Request) { s.drawing(w, r, artPlanSVG) }
