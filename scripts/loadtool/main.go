// Command loadtool helps scripts/load.sh: it reads a revision's edit form as a browser would send
// it, and it plays slow clients against a running server while checking that the server still
// answers others. It is not part of raytable and is never run in CI.
//
//	loadtool form BASE ID           print the edit form of /r/ID, URL-encoded
//	loadtool slow BASE SECONDS N    N clients each send a body one byte per second for SECONDS
package main

import (
	"fmt"
	"io"
	"net"
	"net/http"
	"net/url"
	"os"
	"slices"
	"strconv"
	"strings"
	"sync"
	"time"

	"golang.org/x/net/html"
)

func main() {
	if len(os.Args) < 4 {
		fmt.Fprintln(os.Stderr, "usage: loadtool form BASE ID | loadtool slow BASE SECONDS N")
		os.Exit(2)
	}
	var err error
	switch os.Args[1] {
	case "form":
		err = printForm(os.Args[2], os.Args[3])
	case "slow":
		seconds, _ := strconv.Atoi(os.Args[3])
		n := 8
		if len(os.Args) > 4 {
			n, _ = strconv.Atoi(os.Args[4])
		}
		err = slowClients(os.Args[2], time.Duration(seconds)*time.Second, n)
	default:
		err = fmt.Errorf("unknown command %q", os.Args[1])
	}
	if err != nil {
		fmt.Fprintln(os.Stderr, "loadtool:", err)
		os.Exit(1)
	}
}

// printForm prints the values of the form with data-testid "bench-form": text and hidden inputs,
// each select's chosen option and the textareas, as a browser submits them without a button.
func printForm(base, id string) error {
	resp, err := http.Get(base + "/r/" + id)
	if err != nil {
		return err
	}
	defer resp.Body.Close()
	doc, err := html.Parse(resp.Body)
	if err != nil {
		return err
	}
	var form *html.Node
	walk(doc, func(n *html.Node) {
		if attrOf(n, "data-testid") == "bench-form" {
			form = n
		}
	})
	if form == nil {
		return fmt.Errorf("/r/%s has no bench form", id)
	}
	vals := url.Values{}
	walk(form, func(n *html.Node) {
		name := attrOf(n, "name")
		if n.Type != html.ElementNode || name == "" {
			return
		}
		switch n.Data {
		case "input":
			if t := attrOf(n, "type"); t == "text" || t == "hidden" || t == "" {
				vals.Add(name, attrOf(n, "value"))
			}
		case "textarea":
			v := ""
			if n.FirstChild != nil {
				v = n.FirstChild.Data
			}
			vals.Add(name, strings.TrimPrefix(v, "\n"))
		case "select":
			chosen, first := "", true
			walk(n, func(o *html.Node) {
				if o.Type == html.ElementNode && o.Data == "option" {
					if first || hasAttr(o, "selected") {
						chosen = attrOf(o, "value")
					}
					first = false
				}
			})
			vals.Add(name, chosen)
		}
	})
	fmt.Print(vals.Encode())
	return nil
}

func walk(n *html.Node, f func(*html.Node)) {
	f(n)
	for c := n.FirstChild; c != nil; c = c.NextSibling {
		walk(c, f)
	}
}

func attrOf(n *html.Node, key string) string {
	for _, a := range n.Attr {
		if a.Key == key {
			return a.Val
		}
	}
	return ""
}

func hasAttr(n *html.Node, key string) bool {
	return slices.ContainsFunc(n.Attr, func(a html.Attribute) bool { return a.Key == key })
}

// slowClients opens n connections that each announce a 1 MB import and send it one byte per
// second for d; meanwhile GET / is asked once a second. It prints how long each slow connection
// lasted and why it ended, and the slowest start page, and fails if the start page ever failed or
// took more than two seconds.
func slowClients(base string, d time.Duration, n int) error {
	host := strings.TrimPrefix(base, "http://")
	ends := make([]string, n)
	var wg sync.WaitGroup
	for i := range n {
		wg.Go(func() { ends[i] = slowOne(host, d) })
	}
	var worst time.Duration
	failures := 0
	for deadline := time.Now().Add(d); time.Now().Before(deadline); time.Sleep(time.Second) {
		start := time.Now()
		resp, err := http.Get(base + "/")
		took := time.Since(start)
		if err != nil || resp.StatusCode != http.StatusOK {
			failures++
		}
		if err == nil {
			io.Copy(io.Discard, resp.Body)
			resp.Body.Close()
		}
		worst = max(worst, took)
	}
	wg.Wait()
	for i, e := range ends {
		fmt.Printf("slow client %d: %s\n", i, e)
	}
	fmt.Printf("start page during the slow clients: slowest %v, failures %d\n", worst.Round(time.Millisecond), failures)
	if failures > 0 || worst > 2*time.Second {
		return fmt.Errorf("the server did not stay responsive beside the slow clients")
	}
	return nil
}

// slowOne sends a request whose body trickles in one byte per second for at most d, and says how
// it ended.
func slowOne(host string, d time.Duration) string {
	conn, err := net.Dial("tcp", host)
	if err != nil {
		return "could not connect: " + err.Error()
	}
	defer conn.Close()
	start := time.Now()
	fmt.Fprintf(conn, "POST /import HTTP/1.1\r\nHost: %s\r\nContent-Type: application/json\r\nContent-Length: 1000000\r\n\r\n", host)
	sent := 0
	for time.Since(start) < d {
		if _, err := conn.Write([]byte(" ")); err != nil {
			return fmt.Sprintf("closed by the server after %v and %d bytes (%v)", time.Since(start).Round(time.Second), sent, err)
		}
		sent++
		time.Sleep(time.Second)
	}
	conn.SetReadDeadline(time.Now().Add(time.Second))
	buf := make([]byte, 64)
	k, _ := conn.Read(buf)
	if k > 0 {
		return fmt.Sprintf("answered after %v and %d bytes: %q", time.Since(start).Round(time.Second), sent, strings.SplitN(string(buf[:k]), "\r\n", 2)[0])
	}
	return fmt.Sprintf("still open after %v and %d bytes", time.Since(start).Round(time.Second), sent)
}
